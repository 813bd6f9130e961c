// A key never outgrows its owner or the key that issued it: scopes are cut to the owner's current
// role on every call, an instrument restriction and an expiry bound every key issued with it,
// restricted keys make no lab-wide change and read only their own calls and audit events.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SCOPES } from '../../server/domain/auth/scopes.ts';
import type { UserRow } from '../../server/domain/users/users.repository.ts';
import { createTestApp, createUser, expectProblem, issueKey, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let admin: UserRow;
let adminKey: string;
let instrumentA: string;
let instrumentB: string;

const bearer = (secret: string) => ({ authorization: `Bearer ${secret}` });

async function addInstrument(code: string): Promise<string> {
  const res = await request(t.app).post('/api/v1/instruments').set(bearer(adminKey)).send({ code, name: code, site: 'Bay 1' });
  expect(res.status).toBe(201);
  return res.body.id;
}

beforeAll(async () => {
  t = await createTestApp();
  admin = await createUser(t.db, 'admin');
  adminKey = (await issueKey(t, [...SCOPES], { owner: admin })).secret;
  instrumentA = await addInstrument('OES-A');
  instrumentB = await addInstrument('OES-B');
});
afterAll(() => t.close());

describe('a key and its owner', () => {
  it("loses at once what its owner's new role does not hold, as GET /auth/me shows", async () => {
    const owner = await createUser(t.db, 'manager');
    const key = (await issueKey(t, ['standardizations:activate', 'samples:read', 'methods:write'], { owner })).secret;
    expect((await request(t.app).get('/api/v1/auth/me').set(bearer(key))).body.scopes.sort()).toEqual(
      ['methods:write', 'samples:read', 'standardizations:activate'].sort(),
    );
    const demoted = await request(t.app).patch(`/api/v1/users/${owner.id}`).set(bearer(adminKey)).send({ role: 'viewer' });
    expect(demoted.status).toBe(200);
    expect((await request(t.app).get('/api/v1/auth/me').set(bearer(key))).body.scopes).toEqual(['samples:read']);
    const refused = await request(t.app).post('/api/v1/standardizations/std_x/activate').set(bearer(key)).send({});
    expectProblem(refused, 403);
    expect(refused.body.required_scope).toBe('standardizations:activate');
  });
});

describe('a key restricted to instruments', () => {
  let restricted: string;
  beforeAll(async () => {
    restricted = (await issueKey(t, [...SCOPES], { owner: admin, instrument_ids: [instrumentA] })).secret;
  });

  it('passes its restriction on to a key it issues without one, and refuses a wider one', async () => {
    const inherited = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(restricted))
      .send({ name: 'child', scopes: ['samples:read'] });
    expect(inherited.status).toBe(201);
    expect(inherited.body.instrument_ids).toEqual([instrumentA]);
    const wider = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(restricted))
      .send({ name: 'child', scopes: ['samples:read'], instrument_ids: [instrumentA, instrumentB] });
    expectProblem(wider, 403);
    expect(wider.body.instruments_not_held).toEqual([instrumentB]);
  });

  it('cannot roll a key of the same owner that is not restricted', async () => {
    const open = await issueKey(t, ['samples:read'], { owner: admin });
    const res = await request(t.app).post(`/api/v1/api-keys/${open.id}/roll`).set(bearer(restricted)).send({ overlap_minutes: 5 });
    expectProblem(res, 403);
  });

  it('makes no lab-wide change: instruments, methods, profiles, reference materials, users', async () => {
    const calls = [
      request(t.app).patch(`/api/v1/instruments/${instrumentB}`).send({ name: 'renamed' }),
      request(t.app).patch(`/api/v1/instruments/${instrumentA}`).send({ name: 'renamed' }),
      request(t.app).post('/api/v1/instruments').send({ code: 'OES-C', name: 'C', site: 'Bay 2' }),
      request(t.app).post('/api/v1/methods').send({}),
      request(t.app).post('/api/v1/import-profiles').send({}),
      request(t.app).post('/api/v1/reference-materials').send({}),
      request(t.app).post('/api/v1/users').send({}),
    ];
    for (const call of calls) {
      const res = await call.set(bearer(restricted));
      expectProblem(res, 403);
      expect(res.body.restricted_to_instruments).toEqual([instrumentA]);
    }
    expect((await request(t.app).get(`/api/v1/instruments/${instrumentB}`).set(bearer(adminKey))).body.name).toBe('OES-B');
  });

  it('reads only its own calls in the request log and its own events in the audit trail', async () => {
    const own = await request(t.app).get('/api/v1/request-log?limit=200').set(bearer(restricted));
    expect(own.status).toBe(200);
    const callers = new Set(own.body.data.map((entry: { caller: { id: string } }) => entry.caller.id));
    expect(callers.size).toBe(1);
    const adminCalls = await request(t.app).get('/api/v1/request-log?limit=200').set(bearer(adminKey));
    const someoneElses = adminCalls.body.data.find((entry: { caller: { id: string } }) => !callers.has(entry.caller.id));
    expectProblem(await request(t.app).get(`/api/v1/request-log/${someoneElses.id}`).set(bearer(restricted)), 404);

    const events = await request(t.app).get('/api/v1/audit-events?limit=200').set(bearer(restricted));
    expect(events.status).toBe(200);
    expect(events.body.data.length).toBeGreaterThan(0); // the child key it issued
    expect(new Set(events.body.data.map((event: { actor: { id: string } }) => event.actor.id))).toEqual(callers);
    const all = await request(t.app).get('/api/v1/audit-events?limit=200').set(bearer(adminKey));
    expect(all.body.data.length).toBeGreaterThan(events.body.data.length);
  });
});

describe('a key that expires', () => {
  const expiresAt = new Date(Date.now() + 3_600_000).toISOString();
  let expiring: string;
  beforeAll(async () => {
    expiring = (await issueKey(t, [...SCOPES], { owner: admin, expires_at: expiresAt })).secret;
  });

  it('gives a key it issues without an expiry its own, and refuses one that would outlive it', async () => {
    const child = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(expiring))
      .send({ name: 'child', scopes: ['samples:read'] });
    expect(child.status).toBe(201);
    expect(child.body.expires_at).toBe(expiresAt);
    const later = new Date(Date.now() + 7_200_000).toISOString();
    const longer = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(expiring))
      .send({ name: 'child', scopes: ['samples:read'], expires_at: later });
    expectProblem(longer, 403);
    expect(longer.body.expires_at_limit).toBe(expiresAt);
  });
});
