// Activation: managers and admins only, 409 for a failing element without override_reason, the
// override recorded, audit entry and events written with the change, no double or backdated
// activation, no roll-back to an older run; the next run compares with the set in force.
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();

const hoursAgo = (h: number) => new Date(Date.now() - h * 3600_000).toISOString();
/** C measured at 0.42·(nominal span) → slope ≈ 2.2: far beyond the fail limit 0.5. */
const failingRun = (measuredAt: string) =>
  twoPointRun(
    s,
    burnsAt('high', 1).map((b) => ({ ...b, C: 0.42 })),
    burnsAt('low', 1).map((b) => ({ ...b, C: 0.1 })),
    { measured_at: measuredAt },
  );

describe('POST /api/v1/standardizations/{id}/activate', () => {
  it('is refused to analysts (403 naming standardizations:activate)', async () => {
    const run = await createRun(s, twoPointRun(s, burnsAt('high', 0.98), burnsAt('low', 0.98), { measured_at: hoursAgo(30) }));
    const res = await s.analyst.post(`/api/v1/standardizations/${run.id}/activate`).send({});
    expectProblem(res, 403);
    expect(problemBody(res).required_scope).toBe('standardizations:activate');
    const row = await s.t.db('standardizations').where({ id: run.id }).first();
    expect(row.status).toBe('draft');
  });

  it('answers 409 listing the failing elements without override_reason, and activates with one — recorded, audited, with events', async () => {
    const run = await createRun(s, failingRun(hoursAgo(20)));
    expect(run.flag).toBe('fail');
    const refused = await s.manager.post(`/api/v1/standardizations/${run.id}/activate`).send({});
    expectProblem(refused, 409);
    expect(problemBody(refused).detail).toMatch(/^C is flagged fail\. Activate only with an override_reason/);
    expect(problemBody(refused).failing_elements).toEqual([
      { element: 'C', reasons: [expect.stringContaining('more than the fail limit 0.5')] },
    ]);
    expect(await s.t.db('events').where({ type: 'standardization.activated' })).toHaveLength(0);

    const reason = 'C channel lens cleaned after the run; accepted until the afternoon re-standardization (L. Marsh)';
    const activated = await activate(s, run.id, { override_reason: reason });
    expect(activated).toMatchObject({
      status: 'activated',
      in_force: true,
      activation: { override_reason: reason, activated_by: expect.stringMatching(/^manager\d+@kestrelbend\.test$/) },
    });
    expect(Date.parse(activated.activation.effective_from)).toBeLessThanOrEqual(Date.now());

    const audit = await s.t.db('audit_events').where({ action: 'standardization.activated', target_id: run.id });
    expect(audit).toHaveLength(1);
    expect(JSON.parse(audit[0].after_json)).toMatchObject({ status: 'activated', override_reason: reason, failing_elements: ['C'] });
    expect(JSON.parse(audit[0].before_json)).toEqual({ status: 'draft', set_in_force: null });
    const events = await s.t.db('events').where({ type: 'standardization.activated' });
    expect(events).toHaveLength(1);
    expect(JSON.parse(events[0].data_json)).toMatchObject({
      standardization: { id: run.id, flag: 'fail', override_reason: reason, replaces: null },
    });

    expectProblem(await s.manager.post(`/api/v1/standardizations/${run.id}/activate`).send({ override_reason: reason }), 409);
  });

  it('refuses to activate a run older than the activated one, and a backdated effective_from', async () => {
    const old = await createRun(s, twoPointRun(s, burnsAt('high', 0.99), burnsAt('low', 0.99), { measured_at: hoursAgo(25) }));
    const res = await s.manager.post(`/api/v1/standardizations/${old.id}/activate`).send({});
    expectProblem(res, 409);
    expect(problemBody(res).detail).toMatch(/measured later .* is already activated/);

    const fresh = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.97), { measured_at: hoursAgo(2) }));
    const backdated = await s.admin.post(`/api/v1/standardizations/${fresh.id}/activate`).send({ effective_from: hoursAgo(1) });
    expectProblem(backdated, 422);
    expect(problemBody(backdated).errors?.[0]).toMatchObject({ location: 'body.effective_from', code: 'backdated' });
  });

  it('lets an admin schedule a set; the next run compares with the set in force', async () => {
    const current = (await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/corrections`)).body.data[0].set;
    const run = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.97)));
    // previous_* are the slope and offset of the set in force when the run was measured (now).
    for (const c of run.corrections) {
      const before = current.corrections.find((x: { element: string }) => x.element === c.element);
      expect([c.previous_slope, c.previous_offset]).toEqual([before.slope, before.offset]);
    }
    const later = new Date(Date.now() + 3600_000).toISOString();
    // The set in force was activated over a fail; this run moves every slope back by far more than 15 %.
    const scheduled = await activate(s, run.id, { override_reason: 'back on the references after the override' }, s.admin);
    expect(scheduled.in_force).toBe(true);
    const next = await createRun(s, twoPointRun(s, burnsAt('high', 0.96), burnsAt('low', 0.96)));
    const planned = await activate(s, next.id, { effective_from: later });
    expect(planned).toMatchObject({ in_force: false, activation: { effective_from: later } });
    const now = await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/corrections`);
    expect(now.body.data.map((d: { set: { id: string } }) => d.set.id)).toEqual([run.id]);
    const then = await s.viewer
      .get(`/api/v1/instruments/${s.lab.foundry.id}/corrections`)
      .query({ at: new Date(Date.now() + 2 * 3600_000).toISOString() });
    expect(then.body.data[0]).toMatchObject({ method: { id: s.method.id }, set: { id: next.id, in_force: false } });
  });
});
