// Recomputing a sample against another set or none: on request only, with a reason, audited with
// the results before and after; drafts, other instruments' sets and released samples refused.
import { Decimal } from 'decimal.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, problemBody, type TestApp } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, type DriftSetup, driftSetup, twoPointRun } from './drift-setup.ts';

let t: TestApp;
let s: DriftSetup;
let sampleId: string;
let first: { id: string; corrections: { element: string; slope: string; offset: string }[] };
let second: { id: string };

beforeAll(async () => {
  t = await createTestApp();
  s = await driftSetup(t);
  const push = await s.analyst.post('/api/v1/samples').send({
    sample_code: 'K24-0901-F1',
    instrument_id: s.lab.foundry.id,
    method_id: s.method.id,
    burns: [{ values: { Mn: 0.744 } }, { values: { Mn: 0.756 } }],
  });
  sampleId = push.body.id;
  first = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.95)));
  await activate(s, first.id);
  second = await createRun(s, twoPointRun(s, burnsAt('high', 1.03), burnsAt('low', 1.01)));
});
afterAll(() => t.close());

const recompute = (body: Record<string, unknown>, agent = s.analyst) => agent.post(`/api/v1/samples/${sampleId}/recompute`).send(body);

describe('POST /api/v1/samples/{id}/recompute', () => {
  it('applies an activated set to a sample stored before it, recording the reason and both versions in the audit trail', async () => {
    const res = await recompute({
      correction_set_id: first.id,
      reason: 'Stored before the morning standardization; QA asked for corrected values',
    });
    expect(res.status).toBe(200);
    expect(res.body.correction).toMatchObject({
      set_id: first.id,
      set_ids: [first.id],
      selection: 'requested',
      reason: 'Stored before the morning standardization; QA asked for corrected values',
      recomputed_by: expect.stringMatching(/^analyst\d+@/),
    });
    // decimal.js: mean of α·x + β over the two burns.
    const mn = first.corrections.find((c) => c.element === 'Mn')!;
    const mean = ['0.744', '0.756'].reduce((sum, x) => sum.plus(new Decimal(mn.slope).times(x).plus(mn.offset)), new Decimal(0)).div(2);
    const result = res.body.results.find((r: { element: string }) => r.element === 'Mn');
    expect(result.mean).toBeCloseTo(mean.toNumber(), 14);
    expect(result.raw_mean).toBe(0.75);
    const audit = await t.db('audit_events').where({ action: 'sample.recomputed', target_id: sampleId });
    expect(audit).toHaveLength(1);
    expect(JSON.parse(audit[0].before_json)).toMatchObject({ correction: null, results: [{ element: 'Mn', mean: '0.75' }] });
    expect(JSON.parse(audit[0].after_json)).toMatchObject({
      correction: { set_ids: [first.id] },
      results: [{ element: 'Mn', raw_mean: '0.75' }],
      reason: expect.any(String),
    });
  });

  it('removes the correction with null, again audited', async () => {
    const res = await recompute({ correction_set_id: null, reason: 'Compare with the uncorrected values' });
    expect(res.body.correction).toMatchObject({ set_id: null, set_ids: [], selection: 'requested' });
    expect(res.body.results[0].mean).toBe(0.75);
    expect(res.body.burns.every((b: { correction_set_id: string | null }) => b.correction_set_id === null)).toBe(true);
    expect(await t.db('audit_events').where({ action: 'sample.recomputed', target_id: sampleId })).toHaveLength(2);
  });

  it("refuses a draft set, an unknown one, another instrument's, a missing reason and a released sample", async () => {
    const draft = await recompute({ correction_set_id: second.id, reason: 'try the draft' });
    expectProblem(draft, 422);
    expect(problemBody(draft).errors?.[0]).toMatchObject({ location: 'body.correction_set_id', code: 'unusable_set' });
    expectProblem(await recompute({ correction_set_id: 'std_nope', reason: 'no such set' }), 422);
    const other = await s.analyst
      .post('/api/v1/samples')
      .send({ sample_code: 'B24-0901-S1', instrument_id: s.lab.castHouse.id, method_id: s.method.id, burns: [{ values: { Mn: 0.7 } }] });
    const foreign = await s.analyst
      .post(`/api/v1/samples/${other.body.id}/recompute`)
      .send({ correction_set_id: first.id, reason: 'wrong instrument' });
    expectProblem(foreign, 422);
    expect(problemBody(foreign).errors?.[0].message).toMatch(/another instrument or method/);
    const noReason = await recompute({ correction_set_id: first.id });
    expectProblem(noReason, 400);
    expect(problemBody(noReason).errors?.[0].location).toBe('body.reason');
    expectProblem(await s.viewer.post(`/api/v1/samples/${sampleId}/recompute`).send({ correction_set_id: null, reason: 'viewer' }), 403);
    await t.db('samples').where({ id: sampleId }).update({ status: 'released' }); // release arrives in a later issue
    expectProblem(await recompute({ correction_set_id: first.id, reason: 'after release' }), 409);
    expectProblem(await s.analyst.post('/api/v1/samples/smp_nope/recompute').send({ correction_set_id: null, reason: 'nothing' }), 404);
  });
});
