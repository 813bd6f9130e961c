// The done-when path: a control point beyond 3σ pushed through the API marks the instrument
// `verify` for the method, records control.out_of_control, puts an e-mail in the outbox, and a
// later sample from that instrument is released only with an acknowledgement; a disposition ends it.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { flushAlerts } from '../../../server/domain/alerts/alerts.service.ts';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import {
  createTestApp,
  expectProblem,
  problemBody,
  seedDemoLab,
  signedInAgent,
  type TestApp,
  waitForMail,
} from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;
let manager: request.Agent;
let analystEmail: string;
let controlId: string;

async function pushControl(c: string, at: string) {
  const res = await analyst.post('/api/v1/samples').send({
    sample_code: 'CTRL-FE-1',
    kind: 'control',
    control_sample_id: controlId,
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    burns: [
      { measured_at: at, values: { C: c } },
      { measured_at: at, values: { C: c } },
    ],
  });
  expect(res.status).toBe(201);
  return res.body.id as string;
}

beforeAll(async () => {
  t = await createTestApp({ alertGroupMinutes: 5 });
  lab = await seedDemoLab(t.db);
  const signedIn = await signedInAgent(t, 'analyst');
  analyst = signedIn.agent;
  analystEmail = signedIn.user.email;
  manager = (await signedInAgent(t, 'manager')).agent;
  const prefs = await analyst
    .put('/api/v1/me/alert-preferences')
    .send({ data: [{ kind: 'control_out_of_control', instrument_id: lab.foundry.id }] });
  expect(prefs.status).toBe(200);
  const created = await analyst.post('/api/v1/control-samples').send({
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    code: 'CTRL-FE-1',
    kind: 'in_house',
    description: 'In-house carbon steel control piece',
    elements: [{ element: 'C', centre: '0.450', sd: '0.005', source: 'earlier chart, 2026' }],
  });
  expect(created.status).toBe(201);
  expect(created.headers.location).toBe(`/api/v1/control-samples/${created.body.id}`);
  controlId = created.body.id;
  await t.db('control_limits').update({ valid_from: '2026-01-01T00:00:00.000Z' });
});
afterAll(() => t.close());

describe('a control point beyond 3σ', () => {
  it('keeps the instrument in control while points are within the limits', async () => {
    await pushControl('0.451', '2026-11-30T06:00:00.000Z');
    await pushControl('0.447', '2026-11-30T14:00:00.000Z');
    const res = await analyst.get(`/api/v1/instruments/${lab.foundry.id}`);
    expect(res.status).toBe(200);
    expect(res.body.control).toEqual([]);
  });

  it('marks the instrument verify, records the event and queues an e-mail', async () => {
    // 0.470 is 4 SD above the 0.450 centre line: beyond 3σ (Western Electric 1956, test 1).
    const pointId = await pushControl('0.470', '2026-12-01T06:00:00.000Z');
    const instrument = await analyst.get(`/api/v1/instruments/${lab.foundry.id}`);
    expect(instrument.body.control).toHaveLength(1);
    expect(instrument.body.control[0]).toMatchObject({
      method_id: lab.feMethod.id,
      status: 'verify',
      reason: { sample_id: pointId, violations: [{ element: 'C', rule: 'beyond_3s' }] },
    });
    const event = await t.db('events').where({ type: 'control.out_of_control' }).first();
    expect(JSON.parse(event.data_json)).toMatchObject({
      status: 'verify',
      sample: { id: pointId },
      violations: [{ rule: 'beyond_3s', value: 0.47 }],
    });

    const chart = await analyst.get(`/api/v1/control-samples/${controlId}/chart?element=C`);
    expect(chart.status).toBe(200);
    expect(chart.body.sigma).toMatchObject({ upper_3: expect.closeTo(0.465, 10), lower_3: expect.closeTo(0.435, 10) });
    expect(chart.body.points.map((p: { violations: { rule: string }[] }) => p.violations.map((v) => v.rule))).toEqual([
      [],
      [],
      ['beyond_3s'],
    ]);
    expect(chart.body.points[2].burns_n).toBe(2);
    expect((await analyst.get(`/api/v1/control-samples/${controlId}`)).body.status).toBe('verify');

    // Within the grouping window nothing is sent; after it, one message.
    expect(await flushAlerts(t.ctx)).toBe(0);
    expect(await flushAlerts(t.ctx, new Date(Date.now() + 6 * 60_000))).toBe(1);
    const mail = await waitForMail(t.smtp, (m) => m.to.includes(analystEmail));
    expect(mail.subject).toBe('Meltwire alert: Control CTRL-FE-1 out of control');
    expect(mail.text).toContain('One point beyond 3σ (Western Electric Statistical Quality Control Handbook (1956), test 1)');
    expect(mail.text).toContain(`/control-samples/${controlId}`);
  });

  it('asks for an acknowledgement to release a later sample, and records it', async () => {
    const pushed = await analyst.post('/api/v1/samples').send({
      sample_code: 'K24-0950-F1',
      instrument_id: lab.foundry.id,
      method_id: lab.feMethod.id,
      burns: [{ measured_at: '2026-12-01T08:00:00.000Z', values: { C: 0.45 } }],
    });
    const id = pushed.body.id as string;
    const refused = await manager.post(`/api/v1/samples/${id}/release`).send({ accept_nonconforming: true, comment: 'no grade' });
    expectProblem(refused, 422);
    expect(problemBody(refused).detail).toMatch(/control violation.*One point beyond 3σ/);
    const ok = await manager
      .post(`/api/v1/samples/${id}/release`)
      .send({ accept_nonconforming: true, comment: 'no grade', acknowledge_control: { comment: 'Re-measured on OES-2, agrees' } });
    expect(ok.status).toBe(200);
    const audit = await t.db('audit_events').where({ action: 'sample.released', target_id: id }).first();
    expect(JSON.parse(audit.after_json).control_acknowledgement).toMatchObject({ comment: 'Re-measured on OES-2, agrees' });
  });

  it('is in control again after a disposition', async () => {
    const res = await analyst
      .post(`/api/v1/instruments/${lab.foundry.id}/control-dispositions`)
      .send({ method_id: lab.feMethod.id, cause: 'electrode worn', action: 'electrode re-gapped, control re-run in control' });
    expect(res.status).toBe(201);
    const instrument = await analyst.get(`/api/v1/instruments/${lab.foundry.id}`);
    expect(instrument.body.control[0]).toMatchObject({ status: 'in_control', reason: null });
    expect(instrument.body.control[0].history).toHaveLength(2);
    expectProblem(
      await analyst
        .post(`/api/v1/instruments/${lab.foundry.id}/control-dispositions`)
        .send({ method_id: lab.feMethod.id, cause: 'x', action: 'y' }),
      409,
    );
  });
});
