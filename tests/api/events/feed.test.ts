// GET /api/v1/events: order, resuming from a cursor, the types filter, restricted keys, one event.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, expectProblem, issueKey, problemBody, seedDemoLab, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let writer: string;
let reader: string;

const bearer = (secret: string) => ({ authorization: `Bearer ${secret}` });

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  writer = (await issueKey(t, ['samples:write', 'samples:read'])).secret;
  reader = (await issueKey(t, ['events:read'])).secret;
});
afterAll(() => t.close());

function push(code: string, instrumentId = lab.foundry.id, methodId = lab.feMethod.id) {
  return request(t.app)
    .post('/api/v1/samples')
    .set(bearer(writer))
    .send({ sample_code: code, instrument_id: instrumentId, method_id: methodId, burns: [{ values: { Mn: 0.75 } }] })
    .expect(201);
}

async function feed(query: Record<string, string | number>, key = reader) {
  const res = await request(t.app).get('/api/v1/events').query(query).set(bearer(key));
  expect(res.status).toBe(200);
  return res.body as {
    data: { id: string; sequence: number; type: string; instrument_id: string | null; data: { sample_code?: string } }[];
    next_cursor: string | null;
    has_more: boolean;
  };
}

/** Follows the feed from `after` to its end, `limit` at a time, as an integration would. */
async function follow(after: string | null, query: Record<string, string | number> = {}, key = reader) {
  const seen = [];
  let cursor = after;
  for (;;) {
    const page = await feed({ ...query, ...(cursor ? { after: cursor } : {}) }, key);
    seen.push(...page.data);
    cursor = page.next_cursor;
    if (!page.has_more) return { seen, cursor };
  }
}

describe('GET /api/v1/events', () => {
  it('hands out every event once, in sequence order, page by page from the cursor', async () => {
    const start = (await follow(null)).cursor;
    for (const code of ['K24-1000-F1', 'K24-1001-F1', 'K24-1002-F1', 'K24-1003-F1', 'K24-1004-F1']) await push(code);
    const { seen, cursor } = await follow(start, { limit: 2 });
    expect(seen.map((e) => e.data.sample_code)).toEqual(['K24-1000-F1', 'K24-1001-F1', 'K24-1002-F1', 'K24-1003-F1', 'K24-1004-F1']);
    const sequences = seen.map((e) => e.sequence);
    expect([...sequences].sort((a, b) => a - b)).toEqual(sequences);
    expect(new Set(sequences).size).toBe(5);

    // At the end the cursor stays put: polling with it returns nothing until something happens.
    const idle = await feed({ after: cursor! });
    expect(idle).toEqual({ data: [], next_cursor: cursor, has_more: false });
    await push('K24-1005-F1');
    expect((await feed({ after: cursor! })).data.map((e) => e.data.sample_code)).toEqual(['K24-1005-F1']);
  });

  it('filters by type without losing its place in the order', async () => {
    const start = (await follow(null)).cursor;
    await push('K24-1010-F1');
    const upload = await request(t.app)
      .post('/api/v1/imports')
      .set(bearer((await issueKey(t, ['imports:write'])).secret))
      .field('instrument_id', lab.foundry.id)
      .field('method_id', lab.feMethod.id)
      .attach('file', Buffer.from('Sample,Burn,Mn %\nK24-1011-F1,1,0.7x\n'), 'bad.csv');
    expect(upload.status).toBe(422);
    await push('K24-1012-F1');
    expect((await follow(start)).seen.map((e) => e.type)).toEqual(['sample.created', 'import.failed', 'sample.created']);
    const onlyFailures = await follow(start, { types: 'import.failed,import.completed' });
    expect(onlyFailures.seen.map((e) => e.type)).toEqual(['import.failed']);
    expect((await feed({ after: onlyFailures.cursor!, types: 'sample.created' })).data.map((e) => e.data.sample_code)).toEqual([
      'K24-1012-F1',
    ]);
  });

  it('refuses an unknown type and a cursor it did not make', async () => {
    const res = await request(t.app).get('/api/v1/events').query({ types: 'sample.created,sample.exploded' }).set(bearer(reader));
    expectProblem(res, 400);
    expect(problemBody(res).errors?.[0]).toMatchObject({ location: 'query.types', message: 'unknown event type sample.exploded' });
    expectProblem(await request(t.app).get('/api/v1/events').query({ after: 'bm90LWEtY3Vyc29y' }).set(bearer(reader)), 400);
    const forged = Buffer.from(JSON.stringify({ s: 'x', x: "1'; drop table events" })).toString('base64url');
    expectProblem(await request(t.app).get('/api/v1/events').query({ after: forged }).set(bearer(reader)), 400);
  });

  it('shows a restricted key only the events about its instruments', async () => {
    const start = (await follow(null)).cursor;
    await push('K24-1020-F1', lab.foundry.id, lab.feMethod.id);
    await push('AL-1021', lab.castHouse.id, lab.alMethod.id);
    const restricted = (await issueKey(t, ['events:read'], { instrument_ids: [lab.castHouse.id] })).secret;
    const theirs = (await follow(start, {}, restricted)).seen;
    expect(theirs.map((e) => e.data.sample_code)).toEqual(['AL-1021']);
    const foundryEvent = (await follow(start)).seen.find((e) => e.data.sample_code === 'K24-1020-F1')!;
    expectProblem(await request(t.app).get(`/api/v1/events/${foundryEvent.id}`).set(bearer(restricted)), 404);
    const one = await request(t.app).get(`/api/v1/events/${theirs[0].id}`).set(bearer(restricted));
    expect(one.status).toBe(200);
    expect(one.body).toEqual(theirs[0]);
  });

  it('needs events:read', async () => {
    expectProblem(await request(t.app).get('/api/v1/events').set(bearer(writer)), 403);
  });
});
