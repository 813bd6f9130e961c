// Drift history of one element: one point per run, oldest first, with flag and activation state.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, type TestApp } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, type DriftSetup, driftSetup, twoPointRun } from './drift-setup.ts';

let t: TestApp;
let s: DriftSetup;
const runs: { id: string; corrections: { element: string; slope: string; offset: string }[] }[] = [];

beforeAll(async () => {
  t = await createTestApp();
  s = await driftSetup(t);
  const day = 24 * 3600_000;
  for (const [i, factor] of [0.99, 0.98, 0.97].entries()) {
    runs.push(
      await createRun(
        s,
        twoPointRun(s, burnsAt('high', factor), burnsAt('low', factor + 0.005), {
          measured_at: new Date(Date.now() - (3 - i) * day).toISOString(),
        }),
      ),
    );
  }
  await activate(s, runs[1].id);
});
afterAll(() => t.close());

describe('GET /api/v1/instruments/{id}/drift', () => {
  it('gives slope and offset of the element per run, oldest first, with activation state', async () => {
    const res = await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/drift`).query({ element: 'mn', method_id: s.method.id });
    expect(res.status).toBe(200);
    expect(res.body.element).toBe('Mn');
    expect(res.body.instrument.code).toBe('OES-1');
    expect(res.body.points.map((p: { standardization_id: string }) => p.standardization_id)).toEqual(runs.map((r) => r.id));
    expect(res.body.points.map((p: { slope: string }) => p.slope)).toEqual(
      runs.map((r) => r.corrections.find((c) => c.element === 'Mn')!.slope),
    );
    expect(res.body.points.map((p: { status: string; in_force: boolean }) => [p.status, p.in_force])).toEqual([
      ['draft', false],
      ['activated', true],
      ['draft', false],
    ]);
    expect(res.body.points[1]).toMatchObject({ flag: 'ok', reasons: [], mode: 'two_point', method: { id: s.method.id } });
  });

  it('narrows by time and count; empty for an element no run corrected; 404 for an unknown instrument', async () => {
    const since = new Date(Date.now() - 1.5 * 24 * 3600_000).toISOString();
    const recent = await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/drift`).query({ element: 'Mn', since });
    expect(recent.body.points).toHaveLength(1);
    const last = await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/drift`).query({ element: 'Mn', limit: 2 });
    expect(last.body.points.map((p: { standardization_id: string }) => p.standardization_id)).toEqual([runs[1].id, runs[2].id]);
    expect((await s.viewer.get(`/api/v1/instruments/${s.lab.castHouse.id}/drift`).query({ element: 'Mn' })).body.points).toEqual([]);
    expectProblem(await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/drift`).query({ element: 'Qq' }), 400);
    expectProblem(await s.viewer.get('/api/v1/instruments/ins_nope/drift').query({ element: 'Mn' }), 404);
  });
});

describe('GET /api/v1/instruments/{id}/corrections', () => {
  it('shows the set in force per method, and none for an instrument without one', async () => {
    const res = await s.viewer.get(`/api/v1/instruments/${s.lab.foundry.id}/corrections`);
    expect(res.body.data).toEqual([
      {
        method: { id: s.method.id, code: s.method.code },
        set: expect.objectContaining({ id: runs[1].id, in_force: true, status: 'activated' }),
      },
    ]);
    expect((await s.viewer.get(`/api/v1/instruments/${s.lab.castHouse.id}/corrections`)).body.data).toEqual([]);
  });
});
