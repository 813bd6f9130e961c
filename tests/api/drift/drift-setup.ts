// Shared setup of the drift API tests: the demo lab, a small Fe-base method with three elements
// and σr set, a high and a low reference for it, and signed-in users of each role that matters.
// All values are invented.
import type request from 'supertest';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { afterAll, beforeAll } from 'vitest';
import { createTestApp, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

export interface DriftSetup {
  lab: DemoLab;
  analyst: request.Agent;
  manager: request.Agent;
  admin: request.Agent;
  viewer: request.Agent;
  method: { id: string; code: string };
  high: { id: string; code: string };
  low: { id: string; code: string };
}

let counter = 0;

/** Nominal values of the test references (%): high and low level per element. */
export const NOMINAL = {
  high: { C: '0.812', Mn: '1.502', Cr: '2.15' },
  low: { C: '0.105', Mn: '0.305', Cr: '0.252' },
};

export async function driftSetup(t: TestApp): Promise<DriftSetup> {
  const lab = await seedDemoLab(t.db);
  const analyst = (await signedInAgent(t, 'analyst')).agent;
  const manager = (await signedInAgent(t, 'manager')).agent;
  const admin = (await signedInAgent(t, 'admin')).agent;
  const viewer = (await signedInAgent(t, 'viewer')).agent;
  counter += 1;
  const methodRes = await manager.post('/api/v1/methods').send({
    code: `FE-T${counter}`,
    name: 'Test low-alloy steel',
    matrix: 'Fe',
    elements: [
      { element: 'C', decimals: 3, detection_limit: '0.0015', repeatability_sd: '0.004' },
      { element: 'Mn', decimals: 2, detection_limit: '0.003', repeatability_sd: '0.008' },
      { element: 'Cr', decimals: 2, detection_limit: '0.002', repeatability_sd: '0.01' },
    ],
  });
  if (methodRes.status !== 201) throw new Error(`method: ${methodRes.status} ${methodRes.text}`);
  const reference = async (kind: 'high' | 'low') => {
    const values = Object.entries(NOMINAL[kind]).map(([element, nominal]) => ({ element, nominal }));
    const res = await analyst.post('/api/v1/reference-materials').send({
      code: `T-FE-${kind.toUpperCase()}-${counter}`,
      name: `Test ${kind} steel`,
      matrix: 'Fe',
      kind,
      values,
      certificate: 'invented for tests',
    });
    if (res.status !== 201) throw new Error(`reference: ${res.status} ${res.text}`);
    return { id: res.body.id as string, code: res.body.code as string };
  };
  return {
    lab,
    analyst,
    manager,
    admin,
    viewer,
    method: { id: methodRes.body.id, code: methodRes.body.code },
    high: await reference('high'),
    low: await reference('low'),
  };
}

/**
 * For one test file: a test app with the drift setup, built before its tests and closed after.
 * The object is filled in beforeAll; read its fields inside tests.
 */
export function useDriftSetup(): DriftSetup & { t: TestApp } {
  const state = {} as DriftSetup & { t: TestApp };
  beforeAll(async () => {
    const t = await createTestApp();
    Object.assign(state, await driftSetup(t), { t });
  });
  afterAll(() => state.t?.close());
  return state;
}

type Burns = Record<string, number | string>[];

/** A two-point run with the given burns of the high and the low reference. */
export function twoPointRun(s: DriftSetup, highBurns: Burns, lowBurns: Burns, extra: Record<string, unknown> = {}) {
  return {
    method_id: s.method.id,
    mode: 'two_point',
    measurements: [
      { reference_material_id: s.high.id, burns: highBurns.map((values) => ({ values })) },
      { reference_material_id: s.low.id, burns: lowBurns.map((values) => ({ values })) },
    ],
    ...extra,
  };
}

/** Burns that read the nominal values times `factor` for every element (± a small spread). */
export function burnsAt(kind: 'high' | 'low', factor: number, spread = [0, 0.001, -0.001]): Burns {
  return spread.map((d) =>
    Object.fromEntries(Object.entries(NOMINAL[kind]).map(([el, v]) => [el, Number((Number(v) * (factor + d)).toFixed(4))])),
  );
}

export async function createRun(s: DriftSetup, body: Record<string, unknown>, agent = s.analyst) {
  const res = await agent.post(`/api/v1/instruments/${s.lab.foundry.id}/standardizations`).send(body);
  if (res.status !== 201) throw new Error(`run: ${res.status} ${res.text}`);
  return res.body as {
    id: string;
    flag: string;
    corrections: {
      element: string;
      slope: string;
      offset: string;
      previous_slope: string | null;
      previous_offset: string | null;
      flag: string;
      reasons: string[];
    }[];
  };
}

export async function activate(s: DriftSetup, id: string, body: Record<string, unknown> = {}, agent = s.manager) {
  const res = await agent.post(`/api/v1/standardizations/${id}/activate`).send(body);
  if (res.status !== 200) throw new Error(`activate: ${res.status} ${res.text}`);
  return res.body;
}
