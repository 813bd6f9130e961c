import { Decimal } from 'decimal.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemoIfEmpty } from '../../../server/seed/demo.ts';
import { createTestApp, signedInAgent, type TestApp } from '../../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('demo scenario', () => {
  it('seeds both plants once, with results computed, and never into a non-empty database', async () => {
    expect(await seedDemoIfEmpty(t.db)).toBe(true);
    expect(await seedDemoIfEmpty(t.db)).toBe(false);
    const { agent } = await signedInAgent(t, 'viewer');
    const instruments = await agent.get('/api/v1/instruments');
    expect(instruments.body.data.map((i: { code: string }) => i.code)).toEqual(['OES-1', 'OES-2']);
    const samples = await agent.get('/api/v1/samples').query({ limit: 200 });
    const heats = samples.body.data.filter((s: { kind: string }) => s.kind !== 'control');
    expect(heats).toHaveLength(26);
    expect(heats.every((s: { heat: string }) => /^(K24|B24)-\d{4}$/.test(s.heat))).toBe(true);
    const flagged = await agent.get('/api/v1/samples').query({ flag: 'repeatability_exceeded' });
    expect(flagged.body.data.map((s: { sample_code: string }) => s.sample_code)).toEqual(['K24-0414-F1']);
  });

  it('shows the verdicts a lab meets: conforming, failing, on a rounding tie, undetermined, released and amended', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const bySampleCode = async (code: string) => (await agent.get('/api/v1/samples').query({ sample_code: code })).body.data[0];
    const verdicts = async (conforms: string) =>
      (await agent.get('/api/v1/samples').query({ conforms, limit: 200 })).body.data.map((s: { sample_code: string }) => s.sample_code);
    // The preliminary samples, taken before alloying, fail; every final sample but one conforms.
    expect((await verdicts('false')).every((code: string) => code.endsWith('-P1'))).toBe(true);
    expect(await verdicts('false')).toHaveLength(10);

    // C averages 0.505 exactly: ASTM E29 rounds half to even, to 0.50, the maximum (docs/references.md#astm-e29).
    const tie = await bySampleCode('K24-0417-F1');
    const carbon = tie.conformance.elements.find((e: { element: string }) => e.element === 'C');
    expect(carbon).toMatchObject({ value: '0.505', rounded: '0.50', limit_max: '0.50', verdict: 'within', margin: '0' });
    expect(tie.conformance.conforms).toBe(true);

    // A bound that straddles a limit decides nothing: never "conforms".
    const lot = await bySampleCode('B24-0121-S1');
    expect(lot.conformance.conforms).toBeNull();
    expect(lot.conformance.elements.find((e: { element: string }) => e.element === 'Cr')).toMatchObject({
      verdict: 'undetermined',
      limit_min: '0.04',
    });

    const amended = await bySampleCode('K24-0411-F1');
    expect(amended).toMatchObject({ status: 'released', revision: 2, release: { by: 'lena.marsh@kestrelbend.test' } });
    const revisions = (await agent.get(`/api/v1/samples/${amended.id}/revisions`)).body.data;
    expect(revisions.map((r: { revision: number }) => r.revision)).toEqual([1, 2]);
    expect(revisions[1].reason).toMatch(/Burn 3 sparked on a crack/);
    expect((await bySampleCode('K24-0410-F1')).status).toBe('released');
  });

  it('shows a withheld result and the aluminium balance by difference', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const sample = async (code: string) => (await agent.get('/api/v1/samples').query({ sample_code: code })).body.data[0];
    type Result = { element: string; mean: number; reported: string | null; qualifier: string | null; flags: string[] };
    const element = (s: { results: Result[] }, symbol: string) => s.results.find((r) => r.element === symbol);
    // One Ni burn "<0.002" beside 0.0041 and 0.0043: withheld (spark again), so the balance is unknown too.
    const withheld = await sample('B24-0122-S1');
    expect(element(withheld, 'Ni')).toMatchObject({
      reported: null,
      qualifier: null,
      flags: expect.arrayContaining(['mixed_qualified_burns']),
    });
    expect(element(withheld, 'Al')).toMatchObject({ reported: null, flags: ['balance_by_difference'] });
    // Every other billet lot reports Al as 100 % minus the other reported elements ("<" counted as 0).
    const lot = await sample('B24-0118-S1');
    const al = element(lot, 'Al')!;
    expect(al.flags).toEqual(['balance_by_difference']);
    const others = lot.results
      .filter((r: Result) => r.element !== 'Al' && r.qualifier === null)
      .reduce((sum: Decimal, r: Result) => sum.plus(String(r.mean)), new Decimal(0));
    expect(al.mean).toBeCloseTo(new Decimal(100).minus(others).toNumber(), 12); // decimal.js
    expect(al.reported).toBe(new Decimal(100).minus(others).toDecimalPlaces(2, Decimal.ROUND_HALF_EVEN).toFixed(2));
  });

  it('charts six weeks of control points per instrument: one point beyond 3σ, one run of eight, each disposed of', async () => {
    const { agent } = await signedInAgent(t, 'viewer');
    const list = await agent.get('/api/v1/control-samples');
    expect(list.status).toBe(200);
    const definitions = list.body.data as { id: string; code: string; instrument_id: string; elements: string[]; status: string }[];
    expect(definitions.map((d) => d.code)).toEqual(['KB-CTRL-FE1', 'KB-CTRL-AL1'].sort());
    const violationsOf = async (code: string) => {
      const d = definitions.find((x) => x.code === code)!;
      expect(d.status).toBe('in_control');
      const found: string[] = [];
      for (const element of d.elements) {
        const chart = await agent.get(`/api/v1/control-samples/${d.id}/chart`).query({ element });
        expect(chart.status).toBe(200);
        expect(chart.body.provisional).toBe(false);
        // Two points a shift day, Sundays off, for six weeks.
        expect(chart.body.points).toHaveLength(72);
        for (const p of chart.body.points as { value: number; violations: { rule: string }[] }[])
          for (const v of p.violations) found.push(`${element} ${v.rule}`);
      }
      return { d, found };
    };
    const fe = await violationsOf('KB-CTRL-FE1');
    expect(fe.found).toEqual(['C beyond_3s']);
    const al = await violationsOf('KB-CTRL-AL1');
    expect(al.found).toEqual(['Mg eight_one_side']);

    const instrument = await agent.get(`/api/v1/instruments/${fe.d.instrument_id}`);
    const control = instrument.body.control[0];
    expect(control.status).toBe('in_control');
    expect(control.history.map((h: { status: string }) => h.status)).toEqual(['in_control', 'verify']);
    expect(control.history[0]).toMatchObject({ cause: expect.stringMatching(/Electrode worn/), created_by: 'lena.marsh@kestrelbend.test' });
    expect(control.history[1].violations).toEqual([expect.objectContaining({ element: 'C', rule: 'beyond_3s' })]);
  });
});
