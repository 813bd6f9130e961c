// Burn exclusion rules: the method's minimum of included burns (default 2) and the preview that
// says, before anything is stored, which flags and reported values an exclusion would change.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody, signedInAgent, useDemoLab } from '../helpers/test-app.ts';

const env = useDemoLab('analyst');

function steel(code: string, burns: Record<string, number | string>[], methodId = env.lab.feMethod.id) {
  return {
    sample_code: code,
    heat: code.slice(0, 8),
    grade: 'SAE 1045',
    kind: 'final',
    instrument_id: env.lab.foundry.id,
    method_id: methodId,
    burns: burns.map((values) => ({ values })),
  };
}

async function push(code: string, burns: Record<string, number | string>[], methodId?: string): Promise<string> {
  const res = await env.agent.post('/api/v1/samples').send(steel(code, burns, methodId));
  expect(res.status).toBe(201);
  return res.body.id;
}

const auditCount = async (id: string) => Number((await env.t.db('audit_events').where({ target_id: id }).count({ n: '*' }))[0].n);

describe('minimum of included burns', () => {
  it('refuses to exclude below two burns by default, with a problem that says why and stores nothing', async () => {
    const id = await push('K24-0601-F1', [{ Mn: 0.75 }, { Mn: 0.95 }]);
    const audits = await auditCount(id);
    const res = await env.agent.patch(`/api/v1/samples/${id}/burns/2`).send({ excluded: true, reason: 'porous spot' });
    expectProblem(res, 409);
    const body = problemBody(res);
    expect(body).toMatchObject({ type: '/problems/conflict', min_included_burns: 2, included_burns: 2 });
    expect(body.detail).toBe(
      'Method FE-LA needs at least 2 included burns for a result, and this would leave 1. Spark the sample again (or include another burn first), then exclude this one.',
    );
    const after = await env.agent.get(`/api/v1/samples/${id}`);
    expect(after.body.burns.map((b: { excluded: boolean }) => b.excluded)).toEqual([false, false]);
    expect(after.body.results[0].n).toBe(2);
    expect(await auditCount(id)).toBe(audits);
  });

  it('allows one included burn when the method says so, never none', async () => {
    const { agent: admin } = await signedInAgent(env.t, 'admin');
    const method = await admin.post('/api/v1/methods').send({
      code: 'FE-ONE',
      name: 'Low-alloy steel, single-burn screening',
      matrix: 'Fe',
      elements: [{ element: 'Mn', decimals: 2 }],
      reporting: { min_included_burns: 1 },
    });
    expect(method.status).toBe(201);
    expect(method.body.reporting.min_included_burns).toBe(1);
    const id = await push('K24-0602-F1', [{ Mn: 0.75 }, { Mn: 0.95 }], method.body.id);
    const excluded = await env.agent.patch(`/api/v1/samples/${id}/burns/2`).send({ excluded: true, reason: 'porous spot' });
    expect(excluded.status).toBe(200);
    expect(excluded.body.results[0]).toMatchObject({ n: 1, reported: '0.75', flags: ['single_burn'] });
    const last = await env.agent.patch(`/api/v1/samples/${id}/burns/1`).send({ excluded: true, reason: 'would leave nothing' });
    expectProblem(last, 409);
    expect(problemBody(last).detail).toMatch(/^This would exclude every burn/);
  });

  it('keeps a sample stored with one burn as it is, and always lets a burn be included again', async () => {
    const id = await push('K24-0603-F1', [{ Mn: 0.75 }]);
    expectProblem(await env.agent.patch(`/api/v1/samples/${id}/burns/1`).send({ excluded: true, reason: 'would leave nothing' }), 409);
    const three = await push('K24-0604-F1', [{ Mn: 0.75 }, { Mn: 0.76 }, { Mn: 0.95 }]);
    expect((await env.agent.patch(`/api/v1/samples/${three}/burns/3`).send({ excluded: true, reason: 'crater' })).status).toBe(200);
    expectProblem(await env.agent.patch(`/api/v1/samples/${three}/burns/2`).send({ excluded: true, reason: 'also doubtful' }), 409);
    expect(
      (await env.agent.patch(`/api/v1/samples/${three}/burns/3`).send({ excluded: false, reason: 'crater was elsewhere' })).status,
    ).toBe(200);
  });
});

describe('GET /api/v1/samples/{id}/burns/{n}/exclusion-preview', () => {
  it('says that excluding the outlier clears repeatability exceeded and moves the reported value, storing nothing', async () => {
    const mn = ['0.75', '0.76', '0.95'];
    const id = await push('K24-0610-F1', [
      { Mn: 0.75, C: 0.452 },
      { Mn: 0.76, C: 0.448 },
      { Mn: 0.95, C: 0.45 },
    ]);
    const before = await env.agent.get(`/api/v1/samples/${id}`);
    expect(before.body.results.find((r: { element: string }) => r.element === 'Mn').flags).toContain('repeatability_exceeded');
    const audits = await auditCount(id);

    const res = await env.agent.get(`/api/v1/samples/${id}/burns/3/exclusion-preview`).query({ excluded: 'true' });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    // Independent: decimal.js half-even (ASTM E29) of the exact means, all three burns and the first two.
    const mean = (values: string[]) => values.reduce((sum, v) => sum.plus(v), new Decimal(0)).div(values.length);
    const mnChange = res.body.changes.find((c: { element: string }) => c.element === 'Mn');
    expect(mnChange).toEqual({
      element: 'Mn',
      reported_before: mean(mn).toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2),
      reported_after: mean(mn.slice(0, 2)).toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2),
      flags_cleared: ['repeatability_exceeded'],
      flags_raised: [],
    });
    expect(res.body).toMatchObject({
      burn: 3,
      excluded: true,
      allowed: true,
      refusal: null,
      min_included_burns: 2,
      included_burns_after: 2,
      unit: '%',
      sample_flags_cleared: ['repeatability_exceeded'],
      sample_flags_raised: [],
    });

    const after = await env.agent.get(`/api/v1/samples/${id}`);
    expect(after.body.results).toEqual(before.body.results);
    expect(await auditCount(id)).toBe(audits);
  });

  it('shows the values in the unit asked for, and the refusal the PATCH would give', async () => {
    const id = await push('K24-0611-F1', [{ Mn: 0.75 }, { Mn: 0.76 }, { Mn: 0.95 }]);
    const ppm = await env.agent.get(`/api/v1/samples/${id}/burns/3/exclusion-preview`).query({ excluded: 'true', unit: 'ppm' });
    // 0.82 % mean = 8200 ppm; 0.755 % = 7550 ppm (1 % = 10 000 ppm, NIST SP 811), whole ppm.
    expect(ppm.body.changes[0]).toMatchObject({ element: 'Mn', reported_before: '8200', reported_after: '7550' });

    const two = await push('K24-0612-F1', [{ Mn: 0.75 }, { Mn: 0.76 }]);
    const refused = await env.agent.get(`/api/v1/samples/${two}/burns/1/exclusion-preview`).query({ excluded: 'true' });
    expect(refused.body).toMatchObject({ allowed: false, included_burns_after: 1 });
    const patch = await env.agent.patch(`/api/v1/samples/${two}/burns/1`).send({ excluded: true, reason: 'bad spark' });
    expect(refused.body.refusal).toBe(problemBody(patch).detail);

    const same = await env.agent.get(`/api/v1/samples/${two}/burns/1/exclusion-preview`).query({ excluded: 'false' });
    expect(same.body).toMatchObject({ allowed: true, changes: [], sample_flags_cleared: [] });
  });

  it('answers 404 for an unknown burn and 400 for a bad query', async () => {
    const id = await push('K24-0613-F1', [{ Mn: 0.75 }, { Mn: 0.76 }]);
    expectProblem(await env.agent.get(`/api/v1/samples/${id}/burns/9/exclusion-preview`).query({ excluded: 'true' }), 404);
    expectProblem(await env.agent.get(`/api/v1/samples/${id}/burns/1/exclusion-preview`).query({ excluded: 'maybe' }), 400);
    expectProblem(await env.agent.get(`/api/v1/samples/${id}/burns/1/exclusion-preview`), 400);
  });
});
