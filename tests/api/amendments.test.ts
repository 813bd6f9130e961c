// A released sample changes only through an amendment, which keeps every earlier revision exactly
// as it was served (ISO/IEC 17025 §7.5, §7.8.8), says who, when, why and what changed per element,
// and records sample.amended with both revision numbers.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../server/seed/demo-lab.ts';
import { createTestApp, expectProblem, issueKey, problemBody, seedDemoLab, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;
let manager: request.Agent;
let sampleId: string;
let releasedText: string;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  manager = (await signedInAgent(t, 'manager')).agent;
  const grader = (await issueKey(t, ['grades:write', 'grades:read'])).secret;
  await request(t.app)
    .post('/api/v1/grades')
    .set('authorization', `Bearer ${grader}`)
    .send({
      code: 'SAE 1045',
      title: 'Steel',
      standard: 'SAE J403',
      matrix: 'Fe',
      decision_rule: 'rounding',
      limits: [{ element: 'C', min: '0.43', max: '0.50' }],
    });
  const pushed = await analyst.post('/api/v1/samples').send({
    sample_code: 'K24-1000-F1',
    heat: 'K24-1000',
    grade: 'SAE 1045',
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    burns: [{ values: { C: 0.45, Mn: 0.75 } }, { values: { C: 0.46, Mn: 0.74 } }, { values: { C: 0.62, Mn: 0.75 } }],
  });
  sampleId = pushed.body.id;
  const released = await manager
    .post(`/api/v1/samples/${sampleId}/release`)
    .send({ accept_nonconforming: true, comment: 'Outlier burn noticed later' });
  expect(released.status).toBe(200);
  releasedText = released.text;
});
afterAll(() => t.close());

describe('amendments', () => {
  it('refuses a draft, an analyst, an unknown burn and excluding every burn', async () => {
    const draft = await analyst
      .post('/api/v1/samples')
      .send({ sample_code: 'K24-1001-F1', instrument_id: lab.foundry.id, method_id: lab.feMethod.id, burns: [{ values: { C: 0.45 } }] });
    expectProblem(
      await manager.post(`/api/v1/samples/${draft.body.id}/amendments`).send({ reason: 'typo in heat', heat: 'K24-1001' }),
      409,
    );
    expectProblem(await analyst.post(`/api/v1/samples/${sampleId}/amendments`).send({ reason: 'bad spark', exclude_burns: [3] }), 403);
    const unknown = await manager.post(`/api/v1/samples/${sampleId}/amendments`).send({ reason: 'bad spark', exclude_burns: [9] });
    expectProblem(unknown, 422);
    expect(problemBody(unknown).errors![0].message).toMatch(/no burn 9/);
    expectProblem(await manager.post(`/api/v1/samples/${sampleId}/amendments`).send({ reason: 'all bad', exclude_burns: [1, 2, 3] }), 422);
    expectProblem(await manager.post(`/api/v1/samples/${sampleId}/amendments`).send({ reason: 'nothing' }), 400);
  });

  it('makes revision 2, still released, with the changed elements, the event and the audit entry', async () => {
    const res = await manager
      .post(`/api/v1/samples/${sampleId}/amendments`)
      .send({ reason: 'Burn 3 was a bad spark (porosity)', exclude_burns: [3] });
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/api/v1/samples/${sampleId}/revisions/2`);
    expect(res.body).toMatchObject({ status: 'released', revision: 2 });
    expect(res.body.conformance.conforms).toBe(true);
    const revisions = await manager.get(`/api/v1/samples/${sampleId}/revisions`);
    expect(revisions.body.data.map((r: { revision: number; reason: string | null }) => [r.revision, r.reason])).toEqual([
      [1, null],
      [2, 'Burn 3 was a bad spark (porosity)'],
    ]);
    const changed = revisions.body.data[1].changed_elements;
    expect(changed.map((c: { element: string }) => c.element)).toContain('C');
    const event = await t.db('events').where({ type: 'sample.amended' }).first();
    expect(JSON.parse(event.data_json)).toMatchObject({ from_revision: 1, to_revision: 2 });
    const audit = await t.db('audit_events').where({ action: 'sample.amended', target_id: sampleId }).first();
    expect(audit).toBeDefined();
  });

  it('keeps revision 1 byte for byte as it was released', async () => {
    const first = await manager.get(`/api/v1/samples/${sampleId}/revisions/1`);
    expect(first.status).toBe(200);
    expect(first.text).toBe(releasedText);
    expectProblem(await manager.get(`/api/v1/samples/${sampleId}/revisions/9`), 404);
  });

  it('regrades through an amendment', async () => {
    const res = await manager.post(`/api/v1/samples/${sampleId}/amendments`).send({ reason: 'Sold as another grade', grade: 'ZZ 1' });
    expect(res.body).toMatchObject({ revision: 3, grade: 'ZZ 1', conformance: null });
  });
});
