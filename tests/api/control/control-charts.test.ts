// Control definitions and charts through the API: limits in force at each point's time, limits
// established from the first N points (provisional until then), a burn exclusion re-judges the
// point, a burst of violations is one e-mail, and the standardization advice (ASTM E1329).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { flushAlerts } from '../../../server/domain/alerts/alerts.service.ts';
import { createTestApp, expectProblem, signedInAgent, type TestApp, waitForMail } from '../../helpers/test-app.ts';
import { burnsAt, type DriftSetup, driftSetup, twoPointRun } from '../drift/drift-setup.ts';

let t: TestApp;
let s: DriftSetup;

async function define(code: string, elements: Record<string, unknown>[], extra: Record<string, unknown> = {}) {
  const res = await s.analyst
    .post('/api/v1/control-samples')
    .send({ instrument_id: s.lab.foundry.id, method_id: s.method.id, code, kind: 'reference_material', elements, ...extra });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

async function point(controlId: string, code: string, values: Record<string, number>[], at: string) {
  const res = await s.analyst.post('/api/v1/samples').send({
    sample_code: code,
    kind: 'control',
    control_sample_id: controlId,
    instrument_id: s.lab.foundry.id,
    method_id: s.method.id,
    burns: values.map((v) => ({ measured_at: at, values: v })),
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

const chart = async (id: string, element = 'C') => (await s.viewer.get(`/api/v1/control-samples/${id}/chart?element=${element}`)).body;
const rulesOf = (c: { points: { violations: { rule: string }[] }[] }) => c.points.map((p) => p.violations.map((v) => v.rule));

beforeAll(async () => {
  t = await createTestApp({ alertGroupMinutes: 5 });
  s = await driftSetup(t);
});
afterAll(() => t.close());

describe('control sample definitions', () => {
  it('are refused to a viewer, and need a source for entered limits', async () => {
    const body = { instrument_id: s.lab.foundry.id, method_id: s.method.id, code: 'X', kind: 'in_house', elements: [{ element: 'C' }] };
    expectProblem(await s.viewer.post('/api/v1/control-samples').send(body), 403);
    expectProblem(
      await s.analyst.post('/api/v1/control-samples').send({ ...body, elements: [{ element: 'C', centre: '0.4', sd: '0.01' }] }),
      400,
    );
    expectProblem(await s.analyst.post('/api/v1/control-samples').send({ ...body, elements: [{ element: 'Qq' }] }), 422);
  });

  it('judge each point with the limits in force when it was measured', async () => {
    const id = await define('CRM-A', [
      { element: 'C', centre: '0.400', sd: '0.010', source: 'certificate', valid_from: '2026-01-01T00:00:00Z' },
    ]);
    const patched = await s.analyst
      .patch(`/api/v1/control-samples/${id}`)
      .send({ limits: [{ element: 'C', centre: '0.440', sd: '0.010', source: 'new lot', valid_from: '2026-06-01T00:00:00Z' }] });
    expect(patched.status).toBe(200);
    expect(patched.body.limits.map((l: { centre: string }) => l.centre)).toEqual(['0.400', '0.440']);
    // 0.440 is 4 SD above the old centre line but on the new one.
    await point(id, 'CRM-A', [{ C: 0.44 }], '2026-05-01T00:00:00Z');
    await point(id, 'CRM-A', [{ C: 0.44 }], '2026-07-01T00:00:00Z');
    const c = await chart(id);
    expect(rulesOf(c)).toEqual([['beyond_3s'], []]);
    expect(c.points.map((p: { centre: number }) => p.centre)).toEqual([0.4, 0.44]);
    expect(c.limits.map((l: { valid_from: string; valid_to: string | null }) => [l.valid_from, l.valid_to])).toEqual([
      ['2026-01-01T00:00:00.000Z', '2026-06-01T00:00:00.000Z'],
      ['2026-06-01T00:00:00.000Z', null],
    ]);
    expect(c.moving_ranges).toEqual([expect.objectContaining({ value: 0 })]);
    await s.analyst
      .post(`/api/v1/instruments/${s.lab.foundry.id}/control-dispositions`)
      .send({ method_id: s.method.id, cause: 'old limits', action: 'limits renewed' });
  });

  it('establish limits from the first N points, provisional and unjudged until then', async () => {
    const id = await define('INH-B', [{ element: 'Mn' }], { baseline_n: 3 });
    await point(id, 'INH-B', [{ Mn: 0.7 }], '2026-08-01T00:00:00Z');
    await point(id, 'INH-B', [{ Mn: 0.72 }], '2026-08-02T00:00:00Z');
    expect((await chart(id, 'Mn')).provisional).toBe(true);
    await point(id, 'INH-B', [{ Mn: 0.74 }], '2026-08-03T00:00:00Z');
    const c = await chart(id, 'Mn');
    // Mean of 0.70, 0.72, 0.74 = 0.72; sample SD = 0.02 (n − 1).
    expect(c.provisional).toBe(false);
    expect(c.centre).toBeCloseTo(0.72, 12);
    expect(c.limits[0]).toMatchObject({ established: true, source: 'established from the first 3 of 3 points' });
    expect(c.limits[0].sd).toBeCloseTo(0.02, 12);
    expectProblem(await s.viewer.get(`/api/v1/control-samples/${id}/chart?element=C`), 422);
  });

  it('re-judge a point when a burn is excluded, and a burst of violations is one e-mail', async () => {
    const { user } = await signedInAgent(t, 'manager');
    await t.db('alert_preferences').insert({ user_id: user.id, kind: 'control_out_of_control', instrument_id: null });
    const id = await define('CRM-C', [
      { element: 'Cr', centre: '2.00', sd: '0.01', source: 'certificate', valid_from: '2026-01-01T00:00:00Z' },
    ]);
    // Three burns, mean 2.033 (beyond 2.00 + 3 × 0.01); without burn 2 the mean is 2.00. The method keeps two included.
    const sample = await point(id, 'CRM-C', [{ Cr: 2.0 }, { Cr: 2.1 }, { Cr: 2.0 }], '2026-09-01T00:00:00Z');
    expect(rulesOf(await chart(id, 'Cr'))).toEqual([['beyond_3s']]);
    const excluded = await s.analyst.patch(`/api/v1/samples/${sample}/burns/2`).send({ excluded: true, reason: 'bad spark' });
    expect(excluded.status).toBe(200);
    expect(rulesOf(await chart(id, 'Cr'))).toEqual([[]]);
    await point(id, 'CRM-C', [{ Cr: 1.9 }], '2026-09-02T00:00:00Z');
    expect(await flushAlerts(t.ctx, new Date(Date.now() + 6 * 60_000))).toBe(1);
    const mail = await waitForMail(t.smtp, (m) => m.to.includes(user.email));
    expect(mail.subject).toBe('Meltwire: 2 alerts, first: Control CRM-C out of control');
    expect(mail.text.match(/One point beyond 3σ/g)).toHaveLength(2);
  });

  it('advise against standardizing while the control is in control (ASTM E1329)', async () => {
    await s.analyst
      .post(`/api/v1/instruments/${s.lab.foundry.id}/control-dispositions`)
      .send({ method_id: s.method.id, cause: 'bad spark', action: 'burn excluded, control re-run in control' });
    const res = await s.analyst
      .post(`/api/v1/instruments/${s.lab.foundry.id}/standardizations`)
      .send(twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1)));
    expect(res.status).toBe(201);
    expect(res.body.warnings).toEqual([{ code: 'control_in_control', message: expect.stringContaining('ASTM E1329') }]);
  });
});
