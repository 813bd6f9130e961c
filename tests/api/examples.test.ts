// The integrator examples run as an integrator would run them, against a live server seeded
// with the demo scenario: the typed client (tsx) and the curl scripts (bash, curl, jq).
import { execFile } from 'node:child_process';
import { Decimal } from 'decimal.js';
import { mkdtempSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findUserByEmail } from '../../server/domain/users/users.repository.ts';
import { createApiKey } from '../../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../../server/domain/auth/auth.service.ts';
import type { Scope } from '../../server/domain/auth/scopes.ts';
import { DEMO_USERS } from '../../server/seed/demo-users.ts';
import { startLiveServer } from '../helpers/live-server.ts';

const run = promisify(execFile);
const ROOT = resolve(import.meta.dirname, '../..');
let server: Awaited<ReturnType<typeof startLiveServer>>;

beforeAll(async () => {
  server = await startLiveServer({ console: false });
});
afterAll(() => server?.stop());

async function demoAdminKey(scopes: Scope[]): Promise<string> {
  const admin = await findUserByEmail(server.db, DEMO_USERS[0].email);
  const key = await createApiKey(server.ctx, sessionAuthContext(admin!, 'examples-test'), { name: 'examples', scopes });
  return key.secret;
}

function example(command: string, args: string[], env: Record<string, string>) {
  return run(command, args, { cwd: ROOT, env: { ...process.env, MELTWIRE_URL: server.url, ...env } });
}

async function auditActionsNewestFirst(): Promise<{ id: string; action: string }[]> {
  return server
    .db('audit_events')
    .orderBy([
      { column: 'occurred_at', order: 'desc' },
      { column: 'id', order: 'desc' },
    ])
    .select('id', 'action');
}

describe('examples/client.ts (openapi-fetch, generated types)', () => {
  it('checks its key and pages through the whole audit trail with the cursor', async () => {
    const key = await demoAdminKey(['audit:read']);
    const { stdout } = await example(process.execPath, ['--import', 'tsx', 'examples/client.ts'], { MELTWIRE_KEY: key, PAGE_SIZE: '2' });
    const lines = stdout.trim().split('\n');
    expect(lines[0]).toBe('key of admin@kestrelbend.test, scopes: audit:read');
    const expected = await auditActionsNewestFirst();
    const events = lines.filter((line) => line.startsWith('event ')).map((line) => line.split(' '));
    expect(events.map(([, id, , action]) => ({ id, action }))).toEqual(expected);
    expect(lines.at(-1)).toBe(`pages=${Math.ceil(expected.length / 2)} events=${expected.length}`);
  }, 30_000);

  it('reports a problem with its status, title, detail and request id', async () => {
    const key = await demoAdminKey(['samples:read']);
    const failure = await example(process.execPath, ['--import', 'tsx', 'examples/client.ts'], { MELTWIRE_KEY: key }).catch(
      (error: { code: number; stderr: string }) => error,
    );
    expect(failure).toMatchObject({ code: 1 });
    expect((failure as { stderr: string }).stderr).toMatch(
      /^403 Not allowed: This action needs the scope "audit:read"\. \(request [0-9a-f-]{36}\)/,
    );
  }, 30_000);
});

describe('curl scripts', () => {
  it("whoami.sh prints the key's owner and scopes", async () => {
    const key = await demoAdminKey(['samples:read', 'events:read']);
    const { stdout } = await example('bash', ['examples/whoami.sh'], { MELTWIRE_KEY: key });
    expect(JSON.parse(stdout)).toMatchObject({
      auth: 'api_key',
      user: { email: 'admin@kestrelbend.test' },
      scopes: ['samples:read', 'events:read'],
    });
  });

  it('list-api-keys.sh lists keys by prefix, never by secret', async () => {
    const key = await demoAdminKey(['api-keys:read']);
    const { stdout } = await example('bash', ['examples/list-api-keys.sh'], { MELTWIRE_KEY: key });
    expect(stdout).toContain(`${key.slice(0, 14)}…  active  examples  [api-keys:read]`);
    expect(stdout).not.toContain(key);
  });

  it('audit-trail.sh follows next_cursor to the last page', async () => {
    const key = await demoAdminKey(['audit:read']);
    const { stdout, stderr } = await example('bash', ['examples/audit-trail.sh'], { MELTWIRE_KEY: key, PAGE_SIZE: '3' });
    const expected = await auditActionsNewestFirst();
    const lines = stdout.trim().split('\n');
    expect(lines.map((line) => line.split('  ')[1])).toEqual(expected.map((e) => e.action));
    expect(stderr.trim()).toBe(`pages: ${Math.ceil(expected.length / 3)}`);
  });

  it('fails loudly with the problem body when the key lacks the scope', async () => {
    const key = await demoAdminKey(['samples:read']);
    const failure = await example('bash', ['examples/list-api-keys.sh'], { MELTWIRE_KEY: key }).catch(
      (error: { code: number; stdout: string; stderr: string }) => error,
    );
    expect(failure).toMatchObject({ code: expect.any(Number) });
    expect((failure as { stderr: string }).stderr).toContain('403');
  });
});

describe('sample and import scripts', () => {
  it('push-sample.sh stores the sample once, even when retried with the same Idempotency-Key', async () => {
    const key = await demoAdminKey(['samples:write', 'samples:read']);
    const env = { MELTWIRE_KEY: key, SAMPLE_CODE: 'K24-0999-F1', HEAT: 'K24-0999', IDEMPOTENCY_KEY: 'examples-push-1' };
    const first = await example('bash', ['examples/push-sample.sh'], env);
    const again = await example('bash', ['examples/push-sample.sh'], env);
    expect(again.stdout).toBe(first.stdout);
    const lines = first.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^sample smp_\w+ K24-0999-F1 \(draft\)$/);
    // The demo's correction set in force on OES-1 applies: Mn 0.74, 0.75, 0.75 each corrected to α·x + β,
    // then averaged and rounded half-even to FE-LA's 2 decimals (decimal.js as the independent reference).
    const sample = await server.db('samples').where({ sample_code: 'K24-0999-F1' }).first();
    const [setId] = JSON.parse(sample.correction_json).set_ids;
    const mn = JSON.parse((await server.db('standardizations').where({ id: setId }).first()).corrections_json).find(
      (c: { element: string }) => c.element === 'Mn',
    );
    const D100 = Decimal.clone({ precision: 100 });
    const mean = ['0.74', '0.75', '0.75'].reduce((sum, x) => sum.plus(new D100(mn.slope).times(x).plus(mn.offset)), new D100(0)).div(3);
    expect(lines).toContain(`Mn ${mean.toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2)} %  n=3  flags=`);
    // S: two "<0.002" and 0.003 → mixed qualified burns, withheld under FE-LA's default rule.
    expect(lines.find((l) => l.startsWith('S '))).toMatch(/^S \(not reported\) {2}n=1 {2}flags=.*mixed_qualified_burns/);
    expect(await server.db('samples').where({ sample_code: 'K24-0999-F1' }).pluck('id')).toHaveLength(1);
  }, 30_000);

  it('upload-results.sh imports a file, then recognises the same bytes', async () => {
    const key = await demoAdminKey(['imports:write', 'samples:read']);
    const file = resolve(ROOT, 'tests/fixtures/imports/quirks-wide.utf8-bom.csv');
    const first = await example('bash', ['examples/upload-results.sh', file], { MELTWIRE_KEY: key });
    expect(first.stdout).toMatch(/^imported as imp_\w+\nsamples: \d+ created, 0 rejected; burns: \d+; values: \d+/);
    const again = await example('bash', ['examples/upload-results.sh', file], { MELTWIRE_KEY: key });
    expect(again.stdout).toMatch(/^already imported as imp_\w+ \(same bytes\): nothing created/);
  }, 30_000);

  it('upload-results.sh prints the problem and the broken lines, and fails', async () => {
    const key = await demoAdminKey(['imports:write', 'samples:read']);
    const broken = resolve(ROOT, 'tests/fixtures/imports/broken-value.csv');
    const failure = await example('bash', ['examples/upload-results.sh', broken], { MELTWIRE_KEY: key }).catch(
      (error: { code: number; stderr: string }) => error,
    );
    expect(failure).toMatchObject({ code: 1 });
    expect((failure as { stderr: string }).stderr).toContain('file:line 3:Mn %');
  }, 30_000);

  it('samples-since.sh pages through changes in change order and says where to resume', async () => {
    const key = await demoAdminKey(['samples:read']);
    const since = '2000-01-01T00:00:00Z';
    const { stdout, stderr } = await example('bash', ['examples/samples-since.sh', since], { MELTWIRE_KEY: key, PAGE_SIZE: '7' });
    const expected = await server
      .db('samples')
      .orderBy([{ column: 'updated_at' }, { column: 'id' }])
      .select('sample_code', 'updated_at');
    expect(
      stdout
        .trim()
        .split('\n')
        .map((line) => line.split('  ')[1]),
    ).toEqual(expected.map((s) => s.sample_code));
    expect(stderr.trim()).toBe(`next time: updated_since=${expected.at(-1)!.updated_at}`);
  }, 30_000);
});

describe('change feed script', () => {
  it('follow-events.sh prints each event once across runs, resuming from its saved cursor', async () => {
    const dir = mkdtempSync('/tmp/wt-events-cursor-');
    try {
      const key = await demoAdminKey(['events:read', 'samples:write', 'samples:read']);
      const env = { MELTWIRE_KEY: key, CURSOR_FILE: join(dir, 'cursor'), PAGE_SIZE: '4' };
      const first = (await example('bash', ['examples/follow-events.sh'], env)).stdout.trim().split('\n');
      const kept = await server.db('events').whereNull('endpoint_id').orderBy('sequence').pluck('id');
      expect(first.map((line) => line.split('  ')[3])).toEqual(kept);

      await example('bash', ['examples/push-sample.sh'], { MELTWIRE_KEY: key, SAMPLE_CODE: 'K24-0998-F1', HEAT: 'K24-0998' });
      const second = (await example('bash', ['examples/follow-events.sh'], env)).stdout.trim().split('\n');
      expect(second).toHaveLength(1);
      expect(second[0]).toMatch(/^\d+ {2}\S+ {2}sample\.created {2}evt_\w+ {2}K24-0998-F1$/);
      expect((await example('bash', ['examples/follow-events.sh'], env)).stdout).toBe('');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('standardization script', () => {
  it("run-standardization.sh stores a draft run and prints each element's correction and flag", async () => {
    const key = await demoAdminKey(['standardizations:write', 'standardizations:read', 'samples:read']);
    const { stdout } = await example('bash', ['examples/run-standardization.sh'], { MELTWIRE_KEY: key, DRIFT: '1.03' });
    const lines = stdout.trim().split('\n');
    const [, runId] = /^run (std_\w+) \(draft\): overall (ok|warn|fail)$/.exec(lines[0]) ?? [];
    expect(runId).toBeDefined();
    // Every burn read 3 % high: a two-point slope of 1/1.03 (= 0.9709 …) and an offset near 0 for each element.
    const mn = lines.find((line) => line.startsWith('Mn '));
    expect(mn).toMatch(/^Mn {2}slope 0\.97087\d* {2}offset -?0(\.0*\d+)? {2}ok$/);
    const stored = await server.db('standardizations').where({ id: runId }).first();
    expect(stored.status).toBe('draft');
  }, 30_000);
});
