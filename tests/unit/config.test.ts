import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config.ts';

describe('loadConfig', () => {
  it('applies documented defaults', () => {
    const config = loadConfig({});
    expect(config).toMatchObject({
      env: 'development',
      port: 3000,
      databaseFile: './data/meltwire.db',
      publicUrl: 'http://localhost:3000',
      seedDemo: true,
    });
    expect(config.sessionSecret.length).toBeGreaterThanOrEqual(32);
    expect(config).toMatchObject({ requestLogBodyLimit: 16384, requestLogRetentionDays: 30 });
  });

  it('reads the request log settings and refuses nonsense', () => {
    expect(loadConfig({ REQUEST_LOG_BODY_LIMIT: '4096', REQUEST_LOG_RETENTION_DAYS: '7' })).toMatchObject({
      requestLogBodyLimit: 4096,
      requestLogRetentionDays: 7,
    });
    expect(() => loadConfig({ REQUEST_LOG_BODY_LIMIT: 'lots' })).toThrow(/REQUEST_LOG_BODY_LIMIT/);
    expect(() => loadConfig({ REQUEST_LOG_RETENTION_DAYS: '0' })).toThrow(/REQUEST_LOG_RETENTION_DAYS/);
  });

  it('names every bad variable in one readable error', () => {
    let error: unknown;
    try {
      loadConfig({ PORT: 'eighty', DATABASE_URL: 'mysql://x', SMTP_URL: 'mail.example', SESSION_SECRET: 'short' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ConfigError);
    const message = (error as Error).message;
    for (const name of ['PORT', 'DATABASE_URL', 'SMTP_URL', 'SESSION_SECRET']) expect(message).toContain(name);
  });

  it('requires a session secret in production and does not seed demo data there', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    const config = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40), PUBLIC_URL: 'https://lab.kestrelbend.test/' });
    expect(config.seedDemo).toBe(false);
    expect(config.publicUrl).toBe('https://lab.kestrelbend.test');
  });

  it('opens private webhook URLs only for the development demo unless told otherwise', () => {
    expect(loadConfig({}).webhookAllowPrivate).toBe(true);
    expect(loadConfig({ SEED_DEMO: 'false' }).webhookAllowPrivate).toBe(false);
    expect(loadConfig({ NODE_ENV: 'test' }).webhookAllowPrivate).toBe(false);
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(32), SEED_DEMO: 'true' }).webhookAllowPrivate).toBe(false);
    expect(loadConfig({ WEBHOOK_ALLOW_PRIVATE: 'false' }).webhookAllowPrivate).toBe(false);
    expect(loadConfig({ NODE_ENV: 'test', WEBHOOK_ALLOW_PRIVATE: 'true' }).webhookAllowPrivate).toBe(true);
  });

  it('listens on this machine only unless HOST opens it; production listens on every interface', () => {
    expect(loadConfig({}).host).toBe('127.0.0.1');
    expect(loadConfig({ NODE_ENV: 'test' }).host).toBe('127.0.0.1');
    expect(loadConfig({ HOST: '' }).host).toBe('127.0.0.1');
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40) }).host).toBe('0.0.0.0');
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40), HOST: '127.0.0.1' }).host).toBe('127.0.0.1');
    for (const host of ['0.0.0.0', '::', '::1', '192.168.10.5', 'localhost', 'lab-server.kestrelbend.test'])
      expect(loadConfig({ HOST: host }).host).toBe(host);
    for (const host of ['http://0.0.0.0', '0.0.0.0:3000', 'two words', '-bad'])
      expect(() => loadConfig({ HOST: host }), host).toThrow(/HOST: must be an IP address or host name/);
  });

  it('treats empty variables as unset', () => {
    expect(loadConfig({ PORT: '', SMTP_URL: '' })).toMatchObject({ port: 3000, smtpUrl: undefined });
  });
});
