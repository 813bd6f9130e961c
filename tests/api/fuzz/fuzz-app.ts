// The app the fuzz suites attack: the demo scenario (instruments, methods, references, drift
// runs, samples, users), an all-scope API key, limits raised so that no budget runs out, and
// one listening server so supertest does not open a new one per request. Also a snapshot of
// the database (row counts and a hash of each table's content) to prove refused calls change nothing.
import { createHash } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { SCOPES } from '../../../server/domain/auth/scopes.ts';
import { seedDemoIfEmpty } from '../../../server/seed/demo.ts';
import { createTestApp, issueKey, type TestApp } from '../../helpers/test-app.ts';

export interface FuzzApp {
  t: TestApp;
  server: Server;
  /** Authorization header value of the all-scope key. */
  authorization: string;
  /** Ids of existing resources by table, for path parameters and id fields. */
  ids: Record<string, string[]>;
  emails: string[];
  close(): Promise<void>;
}

const POOL_TABLES = [
  'users',
  'api_keys',
  'instruments',
  'methods',
  'samples',
  'imports',
  'import_profiles',
  'reference_materials',
  'standardizations',
  'request_log',
];

async function listen(server: Server, ports: [number, number]): Promise<void> {
  for (let port = ports[0]; port <= ports[1]; port += 1) {
    const ok = await new Promise<boolean>((resolve) => {
      server.once('error', () => resolve(false));
      server.listen(port, '127.0.0.1', () => resolve(true));
    });
    if (ok) return;
  }
  throw new Error(`no free port in ${ports.join('–')}`);
}

/** What the demo scenario lacks: another key, an invited user, an import profile, an import, logged calls. */
async function seedThroughApi(t: TestApp, authorization: string): Promise<void> {
  const api = (method: 'post' | 'get', url: string) => request(t.app)[method](`/api/v1${url}`).set('authorization', authorization);
  const [instrument] = await t.db('instruments').pluck('id');
  const [method] = await t.db('methods').pluck('id');
  const answers = [
    await api('post', '/api-keys').send({ name: 'fuzz victim', scopes: ['samples:read'] }),
    await api('post', '/users').send({ email: 'invited@kestrelbend.test', name: 'Invited', role: 'viewer' }),
    await api('post', '/import-profiles').send({ name: 'fuzz profile', columns: { sample_code: 'Sample' } }),
    await api('post', '/imports')
      .field('instrument_id', instrument)
      .field('method_id', method)
      .attach('file', Buffer.from('Sample,Heat,Burn,Mn %,C %\nFZ-1,H-1,1,0.75,0.45\nFZ-1,H-1,2,0.76,0.44\n'), 'seed.csv'),
  ];
  for (const res of answers) if (res.status >= 300) throw new Error(`fuzz setup: ${res.status} ${res.text}`);
}

/** `ports`: the range this suite may listen on (4200–4299 are set aside for it). */
export async function createFuzzApp(ports: [number, number]): Promise<FuzzApp> {
  const t = await createTestApp({ rateLimitPerMinute: 10_000_000, loginRateLimitPerMinute: 10_000_000 });
  await seedDemoIfEmpty(t.db);
  const key = await issueKey(t, [...SCOPES]);
  const owner = await t.db('api_keys').where({ id: key.id }).first('created_by');
  await seedThroughApi(t, `Bearer ${key.secret}`);
  const ids: Record<string, string[]> = {};
  for (const table of POOL_TABLES) {
    const rows: { id: string }[] = await t.db(table).select('id').limit(50);
    // The fuzz key and its owner stay out: revoking or disabling them would end the run.
    ids[table] = rows.map((r) => r.id).filter((id) => id !== key.id && id !== owner.created_by);
  }
  const emails: string[] = (await t.db('users').pluck('email')).slice(0, 10);
  const server = createServer((req, res) => t.app(req, res));
  await listen(server, ports);
  return {
    t,
    server,
    authorization: `Bearer ${key.secret}`,
    ids,
    emails,
    async close() {
      await new Promise((resolve) => server.close(resolve));
      await t.close();
    },
  };
}

export function serverUrl(app: FuzzApp): string {
  return `http://127.0.0.1:${(app.server.address() as AddressInfo).port}`;
}

/** Tables and columns that legitimately change on a refused call: logs, audit, idempotency, last use. */
const VOLATILE_TABLES = new Set(['request_log', 'audit_events', 'idempotency_keys', 'knex_migrations', 'knex_migrations_lock']);
const VOLATILE_COLUMNS: Record<string, string[]> = { api_keys: ['last_used_at'], sessions: ['last_seen_at'] };

export type DbSnapshot = Record<string, { rows: number; sha256: string }>;

/** Row count and SHA-256 of the ordered content of every table (SQLite). */
export async function snapshotDb(t: TestApp): Promise<DbSnapshot> {
  const tables: string[] = (await t.db.raw("select name from sqlite_master where type = 'table' and name not like 'sqlite_%'")).map(
    (r: { name: string }) => r.name,
  );
  const snapshot: DbSnapshot = {};
  for (const table of tables.sort()) {
    if (VOLATILE_TABLES.has(table)) continue;
    const rows: Record<string, unknown>[] = await t.db(table).select('*').orderByRaw('rowid');
    const hash = createHash('sha256');
    for (const row of rows) {
      for (const column of VOLATILE_COLUMNS[table] ?? []) delete row[column];
      hash.update(JSON.stringify(row));
      hash.update('\n');
    }
    snapshot[table] = { rows: rows.length, sha256: hash.digest('hex') };
  }
  return snapshot;
}
