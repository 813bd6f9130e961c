// Grades through the API: decimal-string limits (a number is a 400 naming the field), versions
// kept on PUT, evaluation with the grade version it used, and regrading. Limits: SAE J403 and
// SAE 1018 as in docs/references.md#grade-limits.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, issueKey, problemBody, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let writer: string;
let reader: string;

const SAE_1045 = {
  code: 'SAE 1045',
  title: 'Medium-carbon steel',
  standard: 'SAE J403',
  edition: null,
  matrix: 'Fe',
  decision_rule: 'rounding',
  limits: [
    { element: 'C', min: '0.43', max: '0.50' },
    { element: 'Mn', min: '0.60', max: '0.90' },
    { element: 'P', max: '0.040' },
    { element: 'S', max: '0.050' },
  ],
  source_note: 'SAE J403, read in an excerpt; verify against your licensed copy.',
};
const SAE_1018 = {
  ...SAE_1045,
  code: 'SAE 1018',
  title: 'Low-carbon steel',
  limits: [{ element: 'C', min: '0.15', max: '0.20' }, ...SAE_1045.limits.slice(1)],
  source_note: 'From memory; verify.',
};

const as = (secret: string) => ({ authorization: `Bearer ${secret}` });

beforeAll(async () => {
  t = await createTestApp();
  writer = (await issueKey(t, ['grades:read', 'grades:write'])).secret;
  reader = (await issueKey(t, ['grades:read'])).secret;
  for (const grade of [SAE_1045, SAE_1018])
    expect((await request(t.app).post('/api/v1/grades').set(as(writer)).send(grade)).status).toBe(201);
});
afterAll(() => t.close());

describe('grades', () => {
  it('refuses a limit written as a JSON number, naming the field', async () => {
    const res = await request(t.app)
      .post('/api/v1/grades')
      .set(as(writer))
      .send({ ...SAE_1045, code: 'X1', limits: [{ element: 'C', min: 0.43, max: '0.50' }] });
    expectProblem(res, 400);
    expect(problemBody(res).errors).toEqual([
      expect.objectContaining({ location: 'body.limits.0.min', message: expect.stringMatching(/decimal strings/) }),
    ]);
  });

  it('refuses min above max, an unknown element and a duplicate code (any case)', async () => {
    const bad = await request(t.app)
      .post('/api/v1/grades')
      .set(as(writer))
      .send({
        ...SAE_1045,
        code: 'X2',
        limits: [
          { element: 'Qq', max: '1' },
          { element: 'C', min: '0.5', max: '0.4' },
        ],
      });
    expectProblem(bad, 400);
    expect(
      problemBody(bad)
        .errors!.map((e) => e.location)
        .sort(),
    ).toEqual(['body.limits.0.element', 'body.limits.1.max']);
    expectProblem(
      await request(t.app)
        .post('/api/v1/grades')
        .set(as(writer))
        .send({ ...SAE_1045, code: 'sae 1045' }),
      409,
    );
  });

  it('keeps every version: a PUT adds one, verdicts name the version used', async () => {
    const { code: _code, ...definition } = SAE_1045;
    const put = await request(t.app)
      .put(`/api/v1/grades/${encodeURIComponent('SAE 1045')}`)
      .set(as(writer))
      .send({ ...definition, aims: [{ element: 'C', min: '0.44', max: '0.47' }] });
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ code: 'SAE 1045', version: 2, aims: [{ element: 'C', min: '0.44', max: '0.47' }] });
    const versions = await request(t.app).get('/api/v1/grades/sae%201045/versions').set(as(reader));
    expect(versions.body.data.map((v: { version: number }) => v.version)).toEqual([1, 2]);
    expect(versions.body.data[0].aims).toBeUndefined();
    expect((await request(t.app).get('/api/v1/grades/SAE%201045/versions/1').set(as(reader))).body.version).toBe(1);

    const evaluation = await request(t.app)
      .post('/api/v1/grades/SAE%201045/evaluate')
      .set(as(reader))
      .send({ composition: { c: 0.48, MN: '0.75', P: 0.012, S: '<0.002' } });
    expect(evaluation.status).toBe(200);
    expect(evaluation.body).toMatchObject({ conforms: true, decision_rule: 'rounding', grade: { code: 'SAE 1045', version: 2 } });
    expect(evaluation.body.aims[0]).toMatchObject({ element: 'C', within: false });
  });

  it('gives the ASTM E29 answer for a JSON float exactly on a tie (C 0.505 → 0.50, within)', async () => {
    const res = await request(t.app)
      .post('/api/v1/grades/SAE%201045/evaluate')
      .set(as(reader))
      .send({ composition: { C: 0.505, Mn: 0.75, P: 0.012, S: 0.02 } });
    expect(res.body.elements[0]).toMatchObject({ element: 'C', value: '0.505', rounded: '0.50', verdict: 'within', margin: '0' });
  });

  it('never says "conforms" when a qualified value cannot be decided', async () => {
    const res = await request(t.app)
      .post('/api/v1/grades/SAE%201045/evaluate')
      .set(as(reader))
      .send({ composition: { C: 0.45, Mn: 0.75, P: 0.012, S: '<0.06' } });
    expect(res.body.conforms).toBeNull();
    expect(res.body.elements[3].verdict).toBe('undetermined');
  });

  it('refuses a composition value that is not a measurement, naming it', async () => {
    const res = await request(t.app)
      .post('/api/v1/grades/SAE%201045/evaluate')
      .set(as(reader))
      .send({ composition: { C: 'lots', Xx: 1 } });
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors!.map((e) => e.location)
        .sort(),
    ).toEqual(['body.composition.C', 'body.composition.Xx']);
  });

  it('finds every grade a heat meets: a 1045 that missed on carbon is a 1018', async () => {
    const res = await request(t.app)
      .post('/api/v1/grades/match')
      .set(as(reader))
      .send({ composition: { Fe: 98.5, C: 0.18, Mn: 0.75, P: 0.012, S: 0.02 } });
    expect(res.status).toBe(200);
    expect(res.body.matrix).toBe('Fe');
    expect(res.body.data).toEqual([
      expect.objectContaining({ grade: expect.objectContaining({ code: 'SAE 1018', version: 1 }), smallest_margin: '0.02' }),
    ]);
  });

  it('lists the latest versions by code, filtered by matrix, and needs grades:write to change', async () => {
    const list = await request(t.app).get('/api/v1/grades?matrix=Fe').set(as(reader));
    expect(list.body.data.map((g: { code: string; version: number }) => `${g.code} v${g.version}`)).toEqual(['SAE 1018 v1', 'SAE 1045 v2']);
    expect((await request(t.app).get('/api/v1/grades?matrix=Al').set(as(reader))).body.data).toEqual([]);
    expectProblem(await request(t.app).post('/api/v1/grades').set(as(reader)).send(SAE_1045), 403);
    expectProblem(await request(t.app).get('/api/v1/grades/nope').set(as(reader)), 404);
  });
});
