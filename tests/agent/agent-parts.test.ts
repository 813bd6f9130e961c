// The agent's parts on their own: backoff and Retry-After, configuration and where the key comes
// from, stability of files, file name filtering. Sources: docs/references.md.
import { appendFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { backoffDelay, parseRetryAfter, retryDelay } from '../../agent/backoff.ts';
import { ConfigError, parseAgentConfig } from '../../agent/config.ts';
import { fileMatcher } from '../../agent/folder-scan.ts';
import { Ledger } from '../../agent/ledger.ts';
import { StableFiles } from '../../agent/stable-files.ts';

const policy = { baseMs: 1000, capMs: 30_000 };

describe('backoff with full jitter', () => {
  it('draws between 0 and min(cap, base·2^attempt) (Brooker 2015, docs/references.md)', () => {
    expect(backoffDelay(policy, 0, () => 0.999)).toBe(999);
    expect(backoffDelay(policy, 3, () => 0.5)).toBe(4000);
    expect(backoffDelay(policy, 3, () => 0)).toBe(0);
    expect(backoffDelay(policy, 10, () => 1)).toBe(30_000);
    expect(backoffDelay(policy, 5000, () => 1)).toBe(30_000);
  });

  it('reads Retry-After as seconds or an HTTP date (RFC 9110 §10.2.3 examples)', () => {
    expect(parseRetryAfter('120')).toBe(120_000);
    const now = Date.parse('1999-12-31T23:59:00Z');
    expect(parseRetryAfter('Fri, 31 Dec 1999 23:59:59 GMT', now)).toBe(59_000);
    expect(parseRetryAfter('Fri, 31 Dec 1999 23:59:59 GMT', now + 120_000)).toBe(0);
    expect(parseRetryAfter('soon')).toBeUndefined();
    expect(parseRetryAfter(null)).toBeUndefined();
  });

  it('honours Retry-After over the backoff, within the cap', () => {
    expect(retryDelay(policy, 0, 7000, () => 0)).toBe(7000);
    expect(retryDelay(policy, 0, 3_600_000)).toBe(30_000);
    expect(retryDelay(policy, 2, undefined, () => 0.25)).toBe(1000);
  });
});

describe('configuration', () => {
  const dir = mkdtempSync(join(tmpdir(), 'meltwire-agent-config-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const minimal = { server_url: 'https://meltwire.lab.example/', instrument_id: 'ins_1', method_id: 'mth_1', folders: ['results'] };

  it('fills defaults and resolves paths from the configuration folder', () => {
    const config = parseAgentConfig({ ...minimal, api_key: 'mw_live_x' }, dir, {});
    expect(config).toMatchObject({
      server_url: 'https://meltwire.lab.example',
      folders: [join(dir, 'results')],
      ledger_file: join(dir, 'meltwire-agent-ledger.jsonl'),
      patterns: ['*.csv', '*.txt'],
      stable_seconds: 10,
      delete_after_success: false,
      apiKey: 'mw_live_x',
      keySource: 'config',
    });
  });

  it('takes the key from MELTWIRE_AGENT_KEY, then api_key_file, then api_key', () => {
    writeFileSync(join(dir, 'agent.key'), '  mw_live_file\n');
    const both = { ...minimal, api_key: 'mw_live_inline', api_key_file: 'agent.key' };
    expect(parseAgentConfig(both, dir, { MELTWIRE_AGENT_KEY: 'mw_live_env' })).toMatchObject({
      apiKey: 'mw_live_env',
      keySource: 'environment',
    });
    expect(parseAgentConfig(both, dir, {})).toMatchObject({ apiKey: 'mw_live_file', keySource: 'api_key_file' });
    expect(() => parseAgentConfig(minimal, dir, {})).toThrow(/no API key/);
    expect(() => parseAgentConfig({ ...minimal, api_key_file: 'missing.key' }, dir, {})).toThrow(/missing\.key cannot be read/);
  });

  it('accepts examples/agent.json as shipped', () => {
    const example = JSON.parse(readFileSync(join(import.meta.dirname, '../../examples/agent.json'), 'utf8'));
    expect(parseAgentConfig(example, dir, { MELTWIRE_AGENT_KEY: 'mw_live_env' })).toMatchObject({
      keySource: 'environment',
      delete_after_success: false,
    });
  });

  it('refuses unknown fields, bad values and non-http addresses, naming each', () => {
    const attempt = () => parseAgentConfig({ ...minimal, server_url: 'ftp://x', folders: [], poll_seconds: 0, polll: 1 }, dir, {});
    expect(attempt).toThrow(ConfigError);
    expect(attempt).toThrow(/server_url/);
    expect(attempt).toThrow(/folders/);
    expect(attempt).toThrow(/poll_seconds/);
    expect(attempt).toThrow(/polll/);
  });
});

describe('stable files', () => {
  const file = (size: number, mtimeMs: number) => ({ path: '/r/a.csv', name: 'a.csv', size, mtimeMs });

  it('takes a file only after its size and mtime stayed the same for the whole stable time', () => {
    const stable = new StableFiles(2000);
    expect(stable.observe([file(10, 1)], 0)).toEqual([]);
    expect(stable.observe([file(20, 2)], 1500)).toEqual([]); // grew: the clock starts again
    expect(stable.observe([file(20, 2)], 3000)).toEqual([]);
    expect(stable.msUntilSettled(3000)).toBe(500);
    expect(stable.observe([file(20, 2)], 3500)).toEqual([file(20, 2)]);
    expect(stable.observe([file(20, 3)], 3600)).toEqual([]); // touched: same size, new mtime
  });
});

describe('file names', () => {
  it('matches the patterns case-insensitively and never takes hidden or temporary files', () => {
    const matches = fileMatcher(['*.csv', '*.TXT']);
    expect(['K24-0412.csv', 'k24.CSV', 'run.txt'].filter(matches)).toHaveLength(3);
    expect(['~K24.csv', '.K24.csv', 'K24.csv.tmp', 'K24.csv~', 'K24.csv.part', 'K24.lock', 'K24.xlsx'].filter(matches)).toEqual([]);
  });
});

describe('ledger', () => {
  it('reads back what it wrote and skips a line torn by a power cut', () => {
    const dir = mkdtempSync(join(tmpdir(), 'meltwire-agent-ledger-'));
    try {
      const file = join(dir, 'state/ledger.jsonl');
      const entry = {
        sha256: 'ab',
        path: '/r/a.csv',
        size: 3,
        mtime: '2026-12-03T10:00:00.000Z',
        import_id: 'imp_1',
        time: '2026-12-03T10:00:01.000Z',
      };
      const ledger = Ledger.open(file);
      ledger.append({ ...entry, outcome: 'sent' });
      ledger.append({ ...entry, sha256: 'cd', path: '/r/b.csv', outcome: 'rejected', import_id: null });
      appendFileSync(file, '{"sha256":"ef","path":"/r/c.cs');
      const again = Ledger.open(file);
      expect(again.forPath('/r/a.csv')).toMatchObject({ outcome: 'sent', import_id: 'imp_1' });
      expect(again.forPath('/r/b.csv')).toMatchObject({ outcome: 'rejected' });
      expect(again.forPath('/r/c.csv')).toBeUndefined();
      expect(again.deliveredSha('ab')?.path).toBe('/r/a.csv');
      expect(again.deliveredSha('cd')).toBeUndefined(); // a refused file was not delivered
      expect(again.lastDelivery()?.path).toBe('/r/a.csv');
      again.append({ ...entry, path: '/r/copy.csv', outcome: 'duplicate' });
      expect(again.deliveredSha('ab')?.path).toBe('/r/copy.csv');
      expect(again.lastDelivery()?.path).toBe('/r/a.csv'); // a duplicate was not uploaded
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
