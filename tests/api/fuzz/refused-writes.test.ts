// A refused write changes nothing: hundreds of generated writes, each broken in a way that must be
// refused (a "__proto__" key, nesting deeper than 64 levels, malformed JSON, a false or unknown
// Content-Encoding, malformed percent-encoding, an over-long Idempotency-Key, malformed multipart),
// all answered 4xx, and the database — row counts and a hash of every table's content, logs,
// audit trail and idempotency keys aside — is the same afterwards.
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createFuzzApp, type DbSnapshot, type FuzzApp, snapshotDb } from './fuzz-app.ts';
import { describeRequest, document, type FuzzBody, type FuzzRequest, type Operation, operations, send } from './fuzz-requests.ts';
import { mutate, nestedArrays, toJsonText } from './hostile.ts';
import { requestArbitrary } from './request-arbitraries.ts';
import { arbitraryFor, type Vocabulary } from './schema-arbitrary.ts';

const SEED = Number(process.env.FUZZ_SEED ?? 20_261_218);
const RUNS = Math.round(Number(process.env.FUZZ_RUNS ?? 1) * 1500);

let app: FuzzApp;
let vocabulary: Vocabulary;

beforeAll(async () => {
  app = await createFuzzApp([4250, 4299]);
  vocabulary = { schemas: document.components.schemas, ids: app.ids, emails: app.emails };
});
afterAll(() => app?.close());

const writes = operations.filter((op) => op.method !== 'get');
const json = (text: string, encoding?: string): FuzzBody => ({
  kind: 'text',
  contentType: 'application/json',
  text,
  ...(encoding ? { encoding } : {}),
});

interface Broken {
  body: FuzzBody;
  key?: string;
}

/** The request, broken so that it must be refused before anything is written. */
function refused(op: Operation): fc.Arbitrary<FuzzRequest> {
  const shaped = op.body?.contentType === 'application/json' ? arbitraryFor(op.body.schema, vocabulary) : fc.constant({ note: 'x' });
  const breaking: fc.Arbitrary<Broken>[] = [
    fc
      .tuple(shaped, fc.nat())
      .map(([value, at]) => ({ body: json(toJsonText(mutate(value, [{ kind: 'extra', at, key: '__proto__', value: 1 }]))) })),
    fc
      .tuple(shaped, fc.nat(), fc.integer({ min: 65, max: 3000 }))
      .map(([value, at, depth]) => ({ body: json(toJsonText(mutate(value, [{ kind: 'replace', at, value: nestedArrays(depth) }]))) })),
    fc.constantFrom('{', '{"a":1}x', '[1,', "{'a':1}").map((text) => ({ body: json(text) })),
    fc.constantFrom('gzip', 'deflate', 'br', 'compress', 'zstd').map((encoding) => ({ body: json('{"a":1}', encoding) })),
    shaped.map((value) => ({ body: json(toJsonText(value)), key: 'k'.repeat(256) })),
  ];
  // Only an upload route reads a multipart body; elsewhere it is ignored, so it refuses nothing.
  if (op.body?.contentType === 'multipart/form-data') {
    breaking.push(
      fc.constantFrom('garbage', '--XYZ\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\nSample').map((text) => ({
        body: { kind: 'text', contentType: 'multipart/form-data; boundary=XYZ', text },
      })),
    );
  }
  const hasPathParams = op.parameters.some((p) => p.in === 'path');
  return fc.tuple(requestArbitrary(op, vocabulary), fc.oneof(...breaking), fc.boolean()).map(([base, broken, badPath]) => ({
    ...base,
    // A malformed path refuses the call whatever the body.
    url: hasPathParams && badPath ? `/api/v1${op.path.replace(/\{\w+\}/, '%ZZ').replace(/\{\w+\}/g, '1')}` : base.url,
    headers: broken.key ? { 'idempotency-key': broken.key } : base.headers,
    body: broken.body,
  }));
}

function differences(before: DbSnapshot, after: DbSnapshot): string[] {
  const tables = new Set([...Object.keys(before), ...Object.keys(after)]);
  return [...tables]
    .filter((table) => JSON.stringify(before[table]) !== JSON.stringify(after[table]))
    .map((table) => `${table}: ${JSON.stringify(before[table])} → ${JSON.stringify(after[table])}`);
}

// The snapshot reads SQLite's table list and rowid order; on PostgreSQL the operations fuzz still asserts no 5xx.
describe.skipIf(process.env.TEST_DATABASE_URL)('fuzz: refused writes change nothing', () => {
  it('the snapshot sees a write that was not refused', async () => {
    const before = await snapshotDb(app.t);
    const res = await send(app, {
      method: 'patch',
      url: `/api/v1/instruments/${app.ids.instruments[0]}`,
      headers: {},
      body: json(JSON.stringify({ name: 'renamed by the snapshot check' })),
    });
    expect(res.status, res.text).toBe(200);
    expect(differences(before, await snapshotDb(app.t))).toEqual([expect.stringMatching(/^instruments: /)]);
  });

  it(`${RUNS} broken writes over ${writes.length} operations are all 4xx and leave the database as it was`, async () => {
    const before = await snapshotDb(app.t);
    const notRefused: string[] = [];
    let sent = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...writes).chain((op) => refused(op)),
        async (r) => {
          sent += 1;
          const res = await send(app, r);
          if (res.status < 400 || res.status >= 500) notRefused.push(`${describeRequest(r)}\n→ ${res.status} ${res.text.slice(0, 300)}`);
        },
      ),
      { numRuns: RUNS, seed: SEED },
    );
    expect(sent).toBe(RUNS);
    expect(notRefused, `not refused (seed ${SEED}):\n\n${notRefused.slice(0, 3).join('\n\n')}`).toEqual([]);
    expect(differences(before, await snapshotDb(app.t))).toEqual([]);
  }, 120_000);
});
