// The bootstrap CLI, run as a user would: `npm run cli -- …` on a database file.
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.ts';
import { testConfig } from '../../server/config.ts';
import { createDb } from '../../server/db/knex.ts';

const run = promisify(execFile);
const ROOT = resolve(import.meta.dirname, '../..');
const dir = mkdtempSync(join(tmpdir(), 'meltwire-cli-'));
const databaseFile = join(dir, 'cli.db');
const env = { ...process.env, DATABASE_FILE: databaseFile, NODE_ENV: 'test', LOG_LEVEL: 'silent' };

function cli(...args: string[]) {
  return run(process.execPath, ['--import', 'tsx', 'server/cli.ts', ...args], { cwd: ROOT, env });
}

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('npm run cli', () => {
  it('create-admin, then create-key prints a working key as the last line', async () => {
    const admin = await cli('create-admin', '--email', 'Boot@KestrelBend.test', '--password', 'bootstrap-password');
    expect(admin.stdout).toMatch(/created admin Boot@KestrelBend.test/);

    const key = await cli('create-key', '--name', 'furnace screen', '--scopes', 'samples:read,events:read');
    const lines = key.stdout.trim().split('\n');
    const secret = lines[lines.length - 1];
    expect(secret).toMatch(/^mw_live_[0-9A-Za-z]{38}$/);

    const db = createDb({ databaseFile });
    try {
      const app = createApp({ db, config: testConfig({ databaseFile }), consoleDir: '/nonexistent', validateResponses: true });
      const me = await request(app).get('/api/v1/auth/me').set('authorization', `Bearer ${secret}`);
      expect(me.status).toBe(200);
      expect(me.body.scopes.sort()).toEqual(['events:read', 'samples:read']);
      const login = await request(app).post('/api/v1/auth/login').send({ email: 'boot@kestrelbend.test', password: 'bootstrap-password' });
      expect(login.body.user.role).toBe('admin');
    } finally {
      await db.destroy();
    }
  }, 60_000);

  it('explains bad input on stderr with a non-zero exit', async () => {
    await expect(cli('create-key', '--name', 'x', '--scopes', 'samples:fly')).rejects.toMatchObject({
      code: 1,
      stderr: expect.stringContaining('unknown scopes: samples:fly'),
    });
    await expect(cli('create-admin', '--email', 'a@kestrelbend.test', '--password', 'short')).rejects.toMatchObject({
      stderr: expect.stringContaining('at least 10'),
    });
    await expect(cli('melt')).rejects.toMatchObject({ stderr: expect.stringContaining('unknown command') });
  }, 60_000);
});
