// Reference materials: nominal values converted exactly to % (1 % = 10 000 ppm, NIST SP 811 §7.10),
// codes unique ignoring case, duplicates named, read access for viewers only.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../../helpers/test-app.ts';
import type request from 'supertest';

let t: TestApp;
let analyst: request.Agent;
let viewer: request.Agent;
beforeAll(async () => {
  t = await createTestApp();
  analyst = (await signedInAgent(t, 'analyst')).agent;
  viewer = (await signedInAgent(t, 'viewer')).agent;
});
afterAll(() => t.close());

const body = (code: string, extra: Record<string, unknown> = {}) => ({
  code,
  name: 'Invented low-level steel',
  matrix: 'fe',
  kind: 'low',
  values: [
    { element: 'mn', nominal: '0.3050' },
    { element: 'B', nominal: '12', unit: 'ppm' },
    { element: 'N', nominal: '45', unit: 'ppb' },
  ],
  certificate: 'In-house lot 2026-03',
  ...extra,
});

describe('reference materials', () => {
  it('registers a material with its values converted exactly to %, and reads it back', async () => {
    const res = await analyst.post('/api/v1/reference-materials').send(body('KB-FE-LO'));
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/api/v1/reference-materials/${res.body.id}`);
    expect(res.body).toMatchObject({
      code: 'KB-FE-LO',
      matrix: 'Fe',
      kind: 'low',
      certificate: 'In-house lot 2026-03',
      created_by: expect.stringMatching(/^analyst/),
    });
    // 12 ppm = 0.0012 %; 45 ppb = 0.0000045 % (1 % = 10^4 ppm = 10^7 ppb, NIST SP 811 §7.10).
    expect(res.body.values).toEqual([
      { element: 'Mn', nominal: '0.305', given: '0.3050', unit: '%' },
      { element: 'B', nominal: '0.0012', given: '12', unit: 'ppm' },
      { element: 'N', nominal: '0.0000045', given: '45', unit: 'ppb' },
    ]);
    expect((await viewer.get(`/api/v1/reference-materials/${res.body.id}`)).body).toEqual(res.body);
    const audit = await t.db('audit_events').where({ action: 'reference_material.created', target_id: res.body.id });
    expect(audit).toHaveLength(1);
  });

  it('refuses a taken code (409), a repeated element and a bad value (400 naming each)', async () => {
    expectProblem(await analyst.post('/api/v1/reference-materials').send(body('kb-fe-lo')), 409);
    const res = await analyst.post('/api/v1/reference-materials').send(
      body('KB-FE-X', {
        kind: 'medium',
        values: [
          { element: 'Mn', nominal: '0.3' },
          { element: 'MN', nominal: '-1' },
        ],
      }),
    );
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual(['body.kind', 'body.values.1.element', 'body.values.1.nominal']);
  });

  it('lists by code with filters and pages; viewers read but cannot write', async () => {
    await analyst.post('/api/v1/reference-materials').send(body('KB-FE-HI', { kind: 'high' }));
    await analyst.post('/api/v1/reference-materials').send(body('KB-AL-HI', { kind: 'high', matrix: 'Al' }));
    const all = await viewer.get('/api/v1/reference-materials').query({ limit: 2 });
    expect(all.body.data.map((m: { code: string }) => m.code)).toEqual(['KB-AL-HI', 'KB-FE-HI']);
    const next = await viewer.get('/api/v1/reference-materials').query({ limit: 2, cursor: all.body.next_cursor });
    expect(next.body).toMatchObject({ data: [{ code: 'KB-FE-LO' }], next_cursor: null });
    const high = await viewer.get('/api/v1/reference-materials').query({ matrix: 'Fe', kind: 'high' });
    expect(high.body.data.map((m: { code: string }) => m.code)).toEqual(['KB-FE-HI']);
    expectProblem(await viewer.post('/api/v1/reference-materials').send(body('KB-FE-V')), 403);
    expectProblem(await viewer.get('/api/v1/reference-materials/rfm_nope'), 404);
  });
});
