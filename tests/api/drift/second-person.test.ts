// The optional second-person rule (method drift_limits.second_person_activation): whoever ran a
// standardization cannot also activate it; someone else can. Off by default.
import { describe, expect, it } from 'vitest';
import { expectProblem } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();

describe('second-person activation', () => {
  it('is off by default: a manager activates a run of their own', async () => {
    const run = await createRun(s, twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1)), s.manager);
    expect((await activate(s, run.id, {}, s.manager)).status).toBe('activated');
  });

  it('when the method asks for it, refuses the one who ran it (409, nothing changed, no audit) and lets another activate', async () => {
    const rule = await s.manager
      .patch(`/api/v1/methods/${s.method.id}`)
      .send({ drift_limits: { warn: '0.2', fail: '0.5', second_person_activation: true } });
    expect(rule.body.drift_limits.second_person_activation).toBe(true);
    const run = await createRun(s, twoPointRun(s, burnsAt('high', 1.01), burnsAt('low', 1.01)), s.manager);
    const refused = await s.manager.post(`/api/v1/standardizations/${run.id}/activate`).send({});
    expectProblem(refused, 409);
    expect(refused.body).toMatchObject({ rule: 'second_person_activation' });
    expect(refused.body.detail).toMatch(
      /needs a second person to activate a standardization: .* ran this one, so someone else activates it\./,
    );
    expect((await s.viewer.get(`/api/v1/standardizations/${run.id}`)).body.status).toBe('draft');
    expect(await s.t.db('audit_events').where({ action: 'standardization.activated', target_id: run.id })).toHaveLength(0);

    const activated = await activate(s, run.id, {}, s.admin);
    expect(activated.status).toBe('activated');
    const audit = await s.t.db('audit_events').where({ action: 'standardization.activated', target_id: run.id });
    expect(audit).toHaveLength(1);
  });
});
