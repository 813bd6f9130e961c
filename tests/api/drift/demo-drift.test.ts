// The demo scenario's drift history: weeks of runs per instrument, one warn and one fail each,
// the latest good run in force, and every demo sample recording the set it was corrected with.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type request from 'supertest';
import { seedDemoIfEmpty } from '../../../server/seed/demo.ts';
import { createTestApp, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let viewer: request.Agent;
let instruments: { id: string; code: string }[];
beforeAll(async () => {
  t = await createTestApp();
  await seedDemoIfEmpty(t.db);
  viewer = (await signedInAgent(t, 'viewer')).agent;
  instruments = (await viewer.get('/api/v1/instruments')).body.data;
});
afterAll(() => t.close());

type Run = {
  id: string;
  flag: string;
  status: string;
  in_force: boolean;
  measured_at: string;
  corrections: { element: string; flag: string; reasons: string[] }[];
};

describe('demo drift history', () => {
  it('gives each instrument weeks of runs with one warn and one fail, and the latest good run in force', async () => {
    for (const instrument of instruments) {
      const runs: Run[] = (await viewer.get(`/api/v1/instruments/${instrument.id}/standardizations`).query({ limit: 200 })).body.data;
      expect(runs.length).toBeGreaterThanOrEqual(10);
      const span = Date.parse(runs[0].measured_at) - Date.parse(runs[runs.length - 1].measured_at);
      expect(span).toBeGreaterThan(21 * 24 * 3600_000);
      expect(runs.filter((r) => r.flag === 'warn')).toHaveLength(1);
      expect(runs.filter((r) => r.flag === 'fail')).toHaveLength(1);
      const inForce = runs.filter((r) => r.in_force);
      expect(inForce).toHaveLength(1);
      expect(inForce[0]).toMatchObject({ flag: 'ok', status: 'activated' });
      expect(inForce[0].id).toBe(runs.find((r) => r.status === 'activated')!.id);
      for (const run of runs) for (const c of run.corrections) if (c.flag !== 'ok') expect(c.reasons.length).toBeGreaterThan(0);
    }
    const oes1 = instruments.find((i) => i.code === 'OES-1')!;
    const drift = await viewer.get(`/api/v1/instruments/${oes1.id}/drift`).query({ element: 'Mn' });
    expect(drift.body.points.length).toBeGreaterThanOrEqual(10);
    expect(drift.body.points.every((p: { slope: string }) => Math.abs(Number(p.slope) - 1) < 0.2)).toBe(true);
  });

  it('corrects every demo sample with the set in force when its burns were measured', async () => {
    // The heats and lots; the control points (seeded after) are judged on their charts instead.
    const samples = (await viewer.get('/api/v1/samples').query({ limit: 200 })).body.data.filter(
      (s: { kind: string }) => s.kind !== 'control',
    );
    expect(samples).toHaveLength(26);
    for (const summary of samples) {
      const sample = (await viewer.get(`/api/v1/samples/${summary.id}`)).body;
      expect(sample.correction).toMatchObject({ applied_to: 'concentration', selection: 'measurement_time' });
      for (const burn of sample.burns) {
        const inForce = await viewer.get(`/api/v1/instruments/${sample.instrument.id}/corrections`).query({ at: burn.measured_at });
        expect(burn.correction_set_id).toBe(
          inForce.body.data.find((d: { method: { id: string } }) => d.method.id === sample.method.id).set.id,
        );
      }
    }
  });
});
