// Two API nodes on one PostgreSQL, as `npm start` runs them behind a load balancer, with requests
// alternating between them: both start at once (migrations and demo seed run once, one after the
// other); a session made on A works on B; an idempotent POST sent to A and retried on B is replayed,
// not repeated; a rate limit of N per minute holds across both; the start-up housekeeping runs on
// one node only; an import on A is visible on B at once; a node with another SESSION_SECRET refuses
// to start. Runs in the PostgreSQL pass of CI (TEST_DATABASE_URL).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, DEMO_USERS } from '../../../server/seed/demo-users.ts';
import { createPostgresSchema } from '../../helpers/test-app.ts';
import { type ServerProcess, startServerProcess } from '../reliability/server-process.ts';

const PG = process.env.TEST_DATABASE_URL;
const LIMIT = 12;
const SECRET = 'two-nodes-test-session-secret-0123456789abcdef';

let schema: Awaited<ReturnType<typeof createPostgresSchema>>;
let nodes: ServerProcess[] = [];

function envFor(url: string, secret = SECRET): Record<string, string> {
  const database = new URL(url);
  database.searchParams.set('options', `-c search_path=${schema.schema}`);
  return { DATABASE_URL: database.toString(), SESSION_SECRET: secret, RATE_LIMIT_PER_MINUTE: String(LIMIT), LOG_LEVEL: 'info' };
}

beforeAll(async () => {
  if (!PG) return;
  schema = await createPostgresSchema(PG);
  // Both at once: the second waits for the first's migrations and seed instead of failing.
  nodes = await Promise.all([startServerProcess('', 4395, envFor(PG)), startServerProcess('', 4396, envFor(PG))]);
}, 90_000);
afterAll(async () => {
  await Promise.all(nodes.map((node) => node.stop()));
  await schema?.drop();
});

async function call(node: ServerProcess, path: string, init: RequestInit = {}) {
  const res = await fetch(`${node.url}/api/v1${path}`, init);
  return { status: res.status, headers: res.headers, body: (await res.json()) as Record<string, unknown> };
}

const json = (headers: Record<string, string>, body: unknown): RequestInit => ({
  method: 'POST',
  headers: { 'content-type': 'application/json', ...headers },
  body: JSON.stringify(body),
});

describe.runIf(PG)('two nodes on one PostgreSQL', () => {
  it('share sessions, idempotent replays, rate limits, imports and one housekeeping run', async () => {
    const [a, b] = nodes;
    const login = await fetch(`${a.url}/api/v1/auth/login`, json({}, { email: DEMO_USERS[0].email, password: DEMO_PASSWORD }));
    expect(login.status).toBe(200);
    const cookie = { cookie: login.headers.get('set-cookie')!.split(';')[0] };

    // Signed in on A, recognised on B.
    expect((await call(b, '/auth/me', { headers: cookie })).body).toMatchObject({ user: { email: DEMO_USERS[0].email } });

    // The demo was seeded once although both nodes started on the empty database together.
    const instruments = (await call(b, '/instruments', { headers: cookie })).body.data as { id: string; code: string }[];
    expect(new Set(instruments.map((i) => i.code)).size).toBe(instruments.length);
    const methods = (await call(b, '/methods', { headers: cookie })).body.data as { id: string; code: string }[];
    const sample = { sample_code: 'TN-1', instrument_id: instruments[0].id, method_id: methods.find((m) => m.code === 'FE-LA')!.id };

    // Sent to A, retried on B with the same Idempotency-Key: the first answer again, stored once.
    const key = { ...cookie, 'idempotency-key': randomUUID() };
    const first = await call(a, '/samples', json(key, { ...sample, burns: [{ values: { C: 0.2 } }] }));
    expect(first.status).toBe(201);
    const retried = await call(b, '/samples', json(key, { ...sample, burns: [{ values: { C: 0.2 } }] }));
    expect(retried.status).toBe(201);
    expect(retried.headers.get('idempotent-replayed')).toBe('true');
    expect(retried.body.id).toBe(first.body.id);
    const stored = (await call(a, '/samples?sample_code=TN-1', { headers: cookie })).body.data as unknown[];
    expect(stored).toHaveLength(1);

    // An import on A is visible on B at once.
    const form = new FormData();
    form.set('instrument_id', sample.instrument_id);
    form.set('method_id', sample.method_id);
    form.set('file', new Blob(['Sample,C %\nTN-2,0.21\n']), 'two-nodes.csv');
    const imported = await call(a, '/imports', { method: 'POST', headers: cookie, body: form });
    expect(imported.status).toBe(201);
    const [importedId] = (imported.body.report as { sample_ids: string[] }).sample_ids;
    expect((await call(b, `/samples/${importedId}`, { headers: cookie })).status).toBe(200);

    // A key's budget of LIMIT calls a minute holds across both nodes: the LIMIT + 1-th is a 429.
    const issued = await call(a, '/api-keys', json(cookie, { name: 'two nodes', scopes: ['samples:read'] }));
    expect(issued.status).toBe(201);
    const bearer = { authorization: `Bearer ${String(issued.body.secret)}` };
    const statuses: number[] = [];
    for (let i = 0; i <= LIMIT; i++) statuses.push((await call(nodes[i % 2], '/auth/me', { headers: bearer })).status);
    expect(statuses.slice(0, LIMIT).every((s) => s === 200)).toBe(true);
    expect(statuses[LIMIT]).toBe(429);
    expect((await call(nodes[(LIMIT + 1) % 2], '/auth/me', { headers: bearer })).status).toBe(429);

    // The housekeeping both nodes start with ran on one of them.
    const runs = nodes.map(
      (node) =>
        node
          .output()
          .split('\n')
          .filter((line) => line.includes('"housekeeping ran"')).length,
    );
    expect(runs.sort()).toEqual([0, 1]);
  }, 60_000);

  it('refuses to start a node whose SESSION_SECRET differs from the others', async () => {
    await expect(startServerProcess('', 4397, envFor(PG!, 'another-secret-of-at-least-32-characters!!'))).rejects.toThrow(
      /SESSION_SECRET: differs from the secret the nodes on this database have used since/,
    );
  }, 60_000);
});
