import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, issueKey, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('instruments', () => {
  it('registers, lists by code, renames and refuses duplicate codes ignoring case', async () => {
    const { agent } = await signedInAgent(t, 'manager');
    const created = await agent.post('/api/v1/instruments').send({ code: 'OES-9', name: 'Spare stand', site: 'Scrap yard' });
    expect(created.status).toBe(201);
    expect(created.headers.location).toBe(`/api/v1/instruments/${created.body.id}`);
    expectProblem(await agent.post('/api/v1/instruments').send({ code: 'oes-9', name: 'Again', site: 'Yard' }), 409);
    const renamed = await agent.patch(`/api/v1/instruments/${created.body.id}`).send({ name: 'Yard stand' });
    expect(renamed.body).toMatchObject({ code: 'OES-9', name: 'Yard stand' });
    const list = await agent.get('/api/v1/instruments');
    expect(list.body.data.map((i: { code: string }) => i.code)).toContain('OES-9');
    const audit = await agent.get('/api/v1/audit-events').query({ target_id: created.body.id });
    expect(audit.body.data.map((e: { action: string }) => e.action)).toEqual(['instrument.updated', 'instrument.created']);
  });

  it('keeps set-up to managers and admins', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    expectProblem(await agent.post('/api/v1/instruments').send({ code: 'X-1', name: 'x', site: 'y' }), 403);
    expect((await agent.get('/api/v1/instruments')).status).toBe(200);
  });

  it('shows a key restricted to one instrument only that instrument', async () => {
    const lab = await seedDemoLab(t.db);
    const key = await issueKey(t, ['samples:read']);
    await t
      .db('api_keys')
      .where({ id: key.id })
      .update({ instrument_ids_json: JSON.stringify([lab.castHouse.id]) });
    const list = await request(t.app).get('/api/v1/instruments').set('authorization', `Bearer ${key.secret}`);
    expect(list.body.data.map((i: { id: string }) => i.id)).toEqual([lab.castHouse.id]);
    expectProblem(await request(t.app).get(`/api/v1/instruments/${lab.foundry.id}`).set('authorization', `Bearer ${key.secret}`), 404);
  });
});

describe('methods', () => {
  it('normalises element symbols and keeps decimal settings as written', async () => {
    const { agent } = await signedInAgent(t, 'manager');
    const res = await agent.post('/api/v1/methods').send({
      code: 'CU-BR',
      name: 'Brass',
      matrix: 'cu',
      elements: [
        { element: 'PB', decimals: 2, working_range_low: '0.010', working_range_high: '4.00', repeatability_sd: '0.010' },
        { element: 'fe', decimals: 3 },
      ],
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ matrix: 'Cu', default_unit: '%' });
    expect(res.body.elements).toEqual([
      {
        element: 'Pb',
        decimals: 2,
        working_range_low: '0.010',
        working_range_high: '4.00',
        detection_limit: null,
        repeatability_sd: '0.010',
      },
      { element: 'Fe', decimals: 3, working_range_low: null, working_range_high: null, detection_limit: null, repeatability_sd: null },
    ]);
  });

  it('names every bad element setting', async () => {
    const { agent } = await signedInAgent(t, 'manager');
    const res = await agent.post('/api/v1/methods').send({
      code: 'BAD',
      name: 'Bad',
      matrix: 'Fe',
      elements: [
        { element: 'Xx', decimals: 2 },
        { element: 'Mn', decimals: 9 },
        { element: 'C', decimals: 3, working_range_low: '1.0', working_range_high: '0.5' },
        { element: 'mn', decimals: 2 },
        { element: 'Si', decimals: 2, detection_limit: '0,002' },
      ],
    });
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual([
      'body.elements.0.element',
      'body.elements.1.decimals',
      'body.elements.2.working_range_high',
      'body.elements.3.element',
      'body.elements.4.detection_limit',
    ]);
  });
});
