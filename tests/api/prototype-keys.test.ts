// Keys named like Object's members, sent by clients: identification fields, element values and
// file columns called constructor, toString, valueOf or hasOwnProperty are ordinary data on every
// path (push, batch, import, sample detail, CSV export); "__proto__", which JavaScript cannot keep
// as a plain object key, is refused with a problem that names it instead of being dropped.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../server/seed/demo-lab.ts';
import { createTestApp, expectProblem, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../helpers/test-app.ts';

const MEMBER_NAMES = ['constructor', 'toString', 'valueOf', 'hasOwnProperty'];

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  // A sample without any of the fields: its cells in those columns must be empty.
  expect((await analyst.post('/api/v1/samples').send(sample('PK-PLAIN', { furnace: 'EAF-1' }))).status).toBe(201);
});
afterAll(() => t.close());

function sample(code: string, fields: Record<string, string>, values: Record<string, number> = { Mn: 0.71 }) {
  return { sample_code: code, instrument_id: lab.foundry.id, method_id: lab.feMethod.id, fields, burns: [{ values }] };
}

/** JSON text with an own "__proto__" key where the object literal below names it. */
const withProtoKey = (value: unknown) => JSON.stringify(value).replaceAll('"PROTO_KEY"', '"__proto__"');

function upload(csv: string, name: string) {
  return analyst
    .post('/api/v1/imports')
    .field('instrument_id', lab.foundry.id)
    .field('method_id', lab.feMethod.id)
    .attach('file', Buffer.from(csv), name);
}

async function exportCsv(): Promise<string[][]> {
  const res = await analyst.get('/api/v1/samples.csv');
  expect(res.status, res.text).toBe(200);
  return res.text
    .trim()
    .split('\n')
    .map((line) => line.split(','));
}

describe('Object member names are data', () => {
  it.each(MEMBER_NAMES)('a pushed field "%s" is stored, shown and exported', async (name) => {
    const pushed = await analyst.post('/api/v1/samples').send(sample(`PK-${name}`, { [name]: 'x1', furnace: 'EAF-2' }));
    expect(pushed.status, pushed.text).toBe(201);
    expect(pushed.body.fields).toEqual({ [name]: 'x1', furnace: 'EAF-2' });
    const detail = await analyst.get(`/api/v1/samples/${pushed.body.id}`);
    expect(detail.body.fields).toEqual({ [name]: 'x1', furnace: 'EAF-2' });

    const [header, ...rows] = await exportCsv();
    const column = header.indexOf(name);
    expect(column).toBeGreaterThan(0);
    const cell = (code: string) => rows.find((row) => row[1] === code)![column];
    expect(cell(`PK-${name}`)).toBe('x1');
    expect(cell('PK-PLAIN')).toBe('');
  });

  it('a batch with such fields is stored whole', async () => {
    const res = await analyst
      .post('/api/v1/samples/batch')
      .send({ samples: MEMBER_NAMES.map((name, i) => sample(`PK-B${i}`, { [name]: `b${i}` })) });
    expect(res.status, res.text).toBe(201);
    expect(res.body.data.map((s: { fields: Record<string, string> }) => s.fields)).toEqual(
      MEMBER_NAMES.map((name, i) => ({ [name]: `b${i}` })),
    );
    expect((await exportCsv())[0]).toEqual(expect.arrayContaining(MEMBER_NAMES));
  });

  it.each(MEMBER_NAMES)('a burn value keyed "%s" is refused as no element symbol', async (name) => {
    const res = await analyst.post('/api/v1/samples').send(sample('PK-V', {}, { [name]: 0.5, Mn: 0.7 }));
    expectProblem(res, 400);
    expect(problemBody(res).errors?.map((e) => e.location)).toEqual([`body.burns.0.values.${name}`]);
  });

  it.each(MEMBER_NAMES)('an imported column "%s" becomes a field, also when a later row leaves it blank', async (name) => {
    const res = await upload(`Sample,${name},Mn %\nPK-I-${name},first,0.70\nPK-I-${name},,0.72\n`, `${name}.csv`);
    expect(res.status, res.text).toBe(201);
    const warnings = JSON.stringify(res.body.report.warnings);
    expect(warnings).not.toMatch(/native code|function/);
    const listed = await analyst.get('/api/v1/samples').query({ import_id: res.body.id });
    expect(listed.body.data[0].fields).toEqual({ [name]: 'first' });
    expect((await exportCsv())[0]).toContain(name);
  });

  it('a header whose unit reads like an Object member is not a unit', async () => {
    // "constructor" after a symbol is prose, not a unit: the column is an identification field.
    const res = await upload('Sample,Mn constructor,Mn %\nPK-U1,a,0.70\n', 'unit-word.csv');
    expect(res.status, res.text).toBe(201);
    expect(res.body.report.layout.columns.map((c: { role: string }) => c.role)).toEqual(['sample_code', 'field', 'element']);
    const proto = await upload('Sample,Mn __proto__,Mn %\nPK-U3,a,0.70\n', 'unit-proto.csv');
    expect(proto.status, proto.text).toBe(201);
    const preview = await analyst
      .post('/api/v1/imports/preview')
      .field('instrument_id', lab.foundry.id)
      .field('method_id', lab.feMethod.id)
      .attach('file', Buffer.from('Sample,Heat,Mn __proto__,P [ppm]\nPK-U4,H1,0.2,0.5\n'), 'unit-proto.csv');
    expect(preview.status, preview.text).toBe(200);
    const bracketed = await upload('Sample,Mn [constructor],C [__proto__]\nPK-U2,0.70,0.1\n', 'unit-bracket.csv');
    expectProblem(bracketed, 422);
    expect(problemBody(bracketed).errors?.map((e) => e.code)).toEqual(['unknown_unit_header', 'unknown_unit_header']);
  });

  it('a long-layout unit cell or a profile unit named like an Object member is refused', async () => {
    const long = await upload('Sample,Element,Value,Unit\nPK-L1,Mn,0.7,constructor\n', 'long.csv');
    expectProblem(long, 422);
    expect(problemBody(long).errors?.map((e) => e.code)).toEqual(['unknown_unit']);
    const profile = await analyst.post('/api/v1/import-profiles').send({ name: 'odd unit', default_unit: 'constructor' });
    expectProblem(profile, 400);
    expect(problemBody(profile).errors?.map((e) => e.location)).toEqual(['body.default_unit']);
  });
});

describe('"__proto__" is refused, never dropped', () => {
  it('as a pushed field, a burn value key or a batch field: 400 naming where', async () => {
    const cases: [string, string, unknown][] = [
      ['/api/v1/samples', 'body.fields.__proto__', sample('PK-P1', { PROTO_KEY: 'x' })],
      ['/api/v1/samples', 'body.burns.0.values.__proto__', sample('PK-P2', {}, { PROTO_KEY: 0.5, Mn: 0.7 })],
      ['/api/v1/samples/batch', 'body.samples.1.fields.__proto__', { samples: [sample('PK-P3', {}), sample('PK-P4', { PROTO_KEY: 'x' })] }],
    ];
    for (const [url, location, body] of cases) {
      const res = await analyst.post(url).set('content-type', 'application/json').send(withProtoKey(body));
      expectProblem(res, 400);
      expect(problemBody(res).errors).toEqual([{ location, message: expect.stringContaining('__proto__'), code: 'reserved_name' }]);
    }
    const stored = await analyst.get('/api/v1/samples').query({ sample_code: 'PK-P1' });
    expect(stored.body.data).toEqual([]);
  });

  it('as an imported column: 422 naming the column, nothing imported', async () => {
    const res = await upload('Sample,__proto__,Mn %\nPK-I-PROTO,x,0.70\n', 'proto.csv');
    expectProblem(res, 422);
    expect(problemBody(res).errors).toEqual([
      { location: 'file:line 1:__proto__', message: expect.stringContaining('"__proto__"'), code: 'reserved_header' },
    ]);
    expect((await analyst.get('/api/v1/samples').query({ sample_code: 'PK-I-PROTO' })).body.data).toEqual([]);
  });

  it('the CSV export still answers for everyone', async () => {
    const [header] = await exportCsv();
    expect(header.slice(0, 2)).toEqual(['id', 'sample_code']);
  });
});
