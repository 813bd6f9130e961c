// Builds the real app on a real SQLite database (in memory by default) with an in-process
// SMTP server standing in for the hosted mail service. With TEST_DATABASE_URL set (postgres://…),
// every test app gets its own fresh PostgreSQL schema instead, so the same suite proves the
// migrations and queries on PostgreSQL.
import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import type { Logger } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll } from 'vitest';
import { createApp } from '../../server/app.ts';
import { type Config, testConfig } from '../../server/config.ts';
import type { AppContext } from '../../server/context.ts';
import { createDb, type Db } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { createApiKey } from '../../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../../server/domain/auth/auth.service.ts';
import type { Role, Scope } from '../../server/domain/auth/scopes.ts';
import { hashPassword } from '../../server/domain/users/passwords.ts';
import { emailKey, insertUser, type UserRow } from '../../server/domain/users/users.repository.ts';
import type { ImportWorkers } from '../../server/domain/imports/import-workers.ts';
import type { AnyRoute } from '../../server/http/route.ts';
import { newId } from '../../server/lib/ids.ts';
import { nowIso } from '../../server/lib/time.ts';
import { type DemoLab, seedDemoLab } from '../../server/seed/demo-lab.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp.ts';

export const TEST_PASSWORD = 'correct horse battery';

export interface TestApp {
  app: Express;
  db: Db;
  ctx: AppContext;
  smtp: FakeSmtp;
  config: Config;
  close(): Promise<void>;
}

/**
 * The app as served, except that every JSON response is checked against the OpenAPI document:
 * a response that does not match answers 500, so the test that caused it fails.
 * `routes` replaces the /api/v1 operations (tests that need an extra or a broken one);
 * `importWorkers` replaces the import worker pool (tests of a worker that fails); `consoleDir`
 * serves a console build (by default none).
 */
export async function createTestApp(
  overrides: Partial<Config> = {},
  options: { routes?: AnyRoute[]; logger?: Logger; importWorkers?: ImportWorkers; consoleDir?: string } = {},
): Promise<TestApp> {
  const smtp = await startFakeSmtp();
  const config = testConfig({ smtpUrl: smtp.url, ...overrides });
  const pg =
    process.env.TEST_DATABASE_URL && !overrides.databaseFile ? await createPostgresSchema(process.env.TEST_DATABASE_URL) : undefined;
  const db = pg ? createDb({ ...config, databaseUrl: pg.url }, { schema: pg.schema }) : createDb(config);
  await migrateLatest(db);
  const app = createApp({
    db,
    config,
    logger: options.logger,
    outbox: smtp.outbox,
    consoleDir: options.consoleDir ?? '/nonexistent',
    validateResponses: true,
    routes: options.routes,
    importWorkers: options.importWorkers,
  });
  return {
    app,
    db,
    ctx: app.locals.ctx,
    smtp,
    config,
    async close() {
      app.locals.ctx.mailer.close();
      await app.locals.ctx.importWorkers.close();
      await smtp.close();
      await db.destroy();
      await pg?.drop();
    },
  };
}

/** A fresh schema in the PostgreSQL database at `url`, dropped by `drop()`. */
export async function createPostgresSchema(url: string) {
  const schema = `test_${randomBytes(6).toString('hex')}`;
  const admin = createDb({ databaseFile: '', databaseUrl: url });
  await admin.raw(`create schema "${schema}"`);
  await admin.destroy();
  return {
    url,
    schema,
    async drop() {
      const cleanup = createDb({ databaseFile: '', databaseUrl: url });
      await cleanup.raw(`drop schema "${schema}" cascade`);
      await cleanup.destroy();
    },
  };
}

let counter = 0;

export async function createUser(db: Db, role: Role, overrides: Partial<UserRow> = {}): Promise<UserRow> {
  counter += 1;
  const now = nowIso();
  const email = overrides.email ?? `${role}${counter}@kestrelbend.test`;
  const row: UserRow = {
    id: newId('usr'),
    email,
    email_key: emailKey(email),
    name: `${role} ${counter}`,
    role,
    status: 'active',
    password_hash: await hashPassword(TEST_PASSWORD),
    created_at: now,
    updated_at: now,
    last_login_at: null,
    ...overrides,
  };
  await insertUser(db, row);
  return row;
}

/** A supertest agent that keeps cookies, signed in as a new user of the role. */
export async function signedInAgent(t: TestApp, role: Role): Promise<{ agent: request.Agent; user: UserRow }> {
  const user = await createUser(t.db, role);
  const agent = request.agent(t.app);
  const res = await agent.post('/api/v1/auth/login').send({ email: user.email, password: TEST_PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, user };
}

/**
 * For one test file: a test app with the demo lab and an agent signed in as `role`, built before
 * its tests and closed after. Read the fields inside tests (they are set in beforeAll).
 */
export function useDemoLab(role: Role = 'analyst'): { t: TestApp; lab: DemoLab; agent: request.Agent } {
  const state = {} as { t: TestApp; lab: DemoLab; agent: request.Agent };
  beforeAll(async () => {
    state.t = await createTestApp();
    state.lab = await seedDemoLab(state.t.db);
    state.agent = (await signedInAgent(state.t, role)).agent;
  });
  afterAll(() => state.t?.close());
  return state;
}

/** Issues a key through the service, as an admin would, and returns its secret. */
export async function issueKey(
  t: TestApp,
  scopes: Scope[],
  options: { expires_at?: string; owner?: UserRow; instrument_ids?: string[] } = {},
): Promise<{ id: string; secret: string }> {
  const owner = options.owner ?? (await createUser(t.db, 'admin'));
  const key = await createApiKey(t.ctx, sessionAuthContext(owner, 'test'), {
    name: `key ${++counter}`,
    scopes,
    expires_at: options.expires_at,
    instrument_ids: options.instrument_ids,
  });
  return { id: key.id, secret: key.secret };
}

/** Waits until the in-process SMTP server has captured a message matching the predicate. */
export async function waitForMail(
  smtp: FakeSmtp,
  predicate: (m: { to: string[]; subject: string; text: string }) => boolean,
  timeoutMs = 5000,
) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = smtp.outbox.messages().find(predicate);
    if (found) return found;
    if (Date.now() > deadline) throw new Error('no matching e-mail was captured');
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

export function expectProblem(res: request.Response, status: number): void {
  if (res.status !== status) throw new Error(`expected ${status}, got ${res.status}: ${JSON.stringify(res.body)}`);
  if (!String(res.headers['content-type']).startsWith('application/problem+json')) {
    throw new Error(`expected application/problem+json, got ${res.headers['content-type']}`);
  }
  const body = JSON.parse(res.text) as { type?: unknown; title?: unknown; status?: unknown };
  if (typeof body.type !== 'string' || typeof body.title !== 'string' || body.status !== status) {
    throw new Error(`not an RFC 9457 problem: ${res.text}`);
  }
}

export function problemBody(res: request.Response): {
  type: string;
  title: string;
  status: number;
  detail?: string;
  request_id?: string;
  errors?: { location: string; message: string; code?: string }[];
  [extension: string]: unknown;
} {
  return JSON.parse(res.text);
}

/** The demo lab's instruments and methods (invented settings), for ingest tests. */
export { seedDemoLab };

/** Row count as a number (PostgreSQL returns counts as strings). */
export async function countRows(query: { count(arg: Record<string, string>): PromiseLike<Record<string, unknown>[]> }): Promise<number> {
  const [row] = await query.count({ n: '*' });
  return Number(row.n);
}
