// A method's reporting rules through the API: mixed qualified burns withheld or bounded, elements
// outside the method kept but not reported, the matrix by difference, and the sum above 100 %.
// Expected values are worked by hand (and with decimal.js where noted) beside each check.
import { Decimal } from 'decimal.js';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DemoLab } from '../../../server/seed/demo-lab.ts';
import { createTestApp, seedDemoLab, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
let lab: DemoLab;
let analyst: request.Agent;
let manager: request.Agent;

beforeAll(async () => {
  t = await createTestApp();
  lab = await seedDemoLab(t.db);
  analyst = (await signedInAgent(t, 'analyst')).agent;
  manager = (await signedInAgent(t, 'manager')).agent;
});
afterAll(() => t.close());

let counter = 0;
async function push(methodId: string, instrumentId: string, burns: Record<string, number | string>[]) {
  counter += 1;
  const res = await analyst
    .post('/api/v1/samples')
    .send({ sample_code: `RR-${counter}`, instrument_id: instrumentId, method_id: methodId, burns: burns.map((values) => ({ values })) });
  expect(res.status).toBe(201);
  return res.body as {
    flags: string[];
    results: { element: string; mean: number | null; reported: string | null; qualifier: string | null; flags: string[] }[];
  };
}
const steel = (burns: Record<string, number | string>[]) => push(lab.feMethod.id, lab.foundry.id, burns);
const aluminium = (burns: Record<string, number | string>[]) => push(lab.alMethod.id, lab.castHouse.id, burns);
const resultOf = (sample: Awaited<ReturnType<typeof push>>, element: string) => sample.results.find((r) => r.element === element)!;

async function setReporting(methodId: string, reporting: Record<string, unknown>) {
  const res = await manager.patch(`/api/v1/methods/${methodId}`).send({ reporting });
  expect(res.status).toBe(200);
  return res.body;
}

describe('method reporting rules', () => {
  it('shows the safe defaults on every method', async () => {
    const method = (await analyst.get(`/api/v1/methods/${lab.feMethod.id}`)).body;
    expect(method.reporting).toEqual({
      mixed_qualified_burns: 'withhold',
      balance_by_difference: false,
      sum_tolerance: '0.5',
      unlisted_elements: 'keep_unreported',
      min_included_burns: 2,
    });
  });

  it('withholds mixed "<" and numeric burns by default, and bounds them under treat_as_bound with no mean', async () => {
    const burns = [{ Ti: '<0.002' }, { Ti: 0.03 }, { Ti: 0.034 }];
    const withheld = resultOf(await steel(burns), 'Ti');
    expect(withheld).toMatchObject({ reported: null, qualifier: null, mean: 0.032 });
    expect(withheld.flags).toContain('mixed_qualified_burns');

    await setReporting(lab.feMethod.id, { mixed_qualified_burns: 'treat_as_bound' });
    // (0.002 + 0.030 + 0.034) / 3 = 0.022, rounded up at the method's 3 decimals: "<0.022".
    const bound = resultOf(await steel(burns), 'Ti');
    expect(bound).toMatchObject({ reported: '0.022', qualifier: '<', mean: null });
    await setReporting(lab.feMethod.id, { mixed_qualified_burns: 'withhold' });
  });

  it('keeps an element outside the method unreported unless the method reports unlisted elements', async () => {
    const kept = resultOf(
      await steel([
        { C: 0.45, W: 0.012 },
        { C: 0.46, W: 0.014 },
      ]),
      'W',
    );
    expect(kept).toMatchObject({ mean: 0.013, reported: null, flags: ['not_in_method'] });
    await setReporting(lab.feMethod.id, { unlisted_elements: 'report' });
    const reported = resultOf(
      await steel([
        { C: 0.45, W: 0.012 },
        { C: 0.46, W: 0.014 },
      ]),
      'W',
    );
    expect(reported).toMatchObject({ mean: 0.013, reported: '0.0130' }); // 4 decimals for unlisted elements
    await setReporting(lab.feMethod.id, { unlisted_elements: 'keep_unreported' });
  });

  it('reports the matrix by difference when the method says so, and flags it', async () => {
    await setReporting(lab.alMethod.id, { balance_by_difference: true });
    const sample = await aluminium([
      { Si: 0.62, Fe: 0.38, Mg: 0.98, Cu: 0.27, Pb: '<0.002' },
      { Si: 0.64, Fe: 0.36, Mg: 1.0, Cu: 0.27, Pb: '<0.002' },
    ]);
    const al = resultOf(sample, 'Al');
    // 100 − (0.63 + 0.37 + 0.99 + 0.27 + 0 for "<0.002") = 97.74, checked with decimal.js.
    const expected = new Decimal(100).minus(new Decimal('0.63').plus('0.37').plus('0.99').plus('0.27'));
    expect(al).toMatchObject({ mean: expected.toNumber(), reported: '97.74', qualifier: null, flags: ['balance_by_difference'] });
    expect(sample.flags).toContain('balance_by_difference');
    expect(sample.results.at(-1)?.element).toBe('Al');
    await setReporting(lab.alMethod.id, { balance_by_difference: false });
  });

  it('flags a sample whose elements add up to more than 100 % plus the tolerance', async () => {
    // A method without working ranges, so that large values are reported as measured.
    const created = await manager.post('/api/v1/methods').send({
      code: 'NI-CR-TEST',
      name: 'Ni–Cr test method',
      matrix: 'Ni',
      elements: [
        { element: 'Ni', decimals: 2 },
        { element: 'Cr', decimals: 2 },
      ],
    });
    expect(created.status).toBe(201);
    const nickel = (burns: Record<string, number>[]) => push(created.body.id, lab.foundry.id, burns);
    // 60 + 40.4 = 100.4: within 0.5 % of 100; 60 + 40.6 = 100.6: beyond it.
    expect((await nickel([{ Ni: 60, Cr: 40.4 }])).flags).not.toContain('sum_above_100');
    expect((await nickel([{ Ni: 60, Cr: 40.6 }])).flags).toContain('sum_above_100');
    await setReporting(created.body.id, { sum_tolerance: '1' });
    expect((await nickel([{ Ni: 60, Cr: 40.6 }])).flags).not.toContain('sum_above_100');
    // With the matrix by difference, 100 − 40.6 = 59.4 replaces the measured Ni: nothing is above 100 %.
    await setReporting(created.body.id, { sum_tolerance: '0.5', balance_by_difference: true });
    const balanced = await nickel([{ Ni: 60, Cr: 40.6 }]);
    expect(resultOf(balanced, 'Ni')).toMatchObject({ reported: '59.40', flags: ['balance_by_difference'] });
    expect(balanced.flags).not.toContain('sum_above_100');
  });

  it('refuses reporting rules it does not know, naming the field', async () => {
    const res = await manager.patch(`/api/v1/methods/${lab.feMethod.id}`).send({ reporting: { mixed_qualified_burns: 'average' } });
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { location: string }) => e.location)).toContain('body.reporting.mixed_qualified_burns');
  });
});
