// Applying the set in force: after an activation every new burn (JSON push or file import) is
// corrected by exactly α·x + β per element (checked with decimal.js on the stored strings), with
// the set recorded; samples stored before are untouched; the set is chosen by measurement time.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();

const D200 = Decimal.clone({ precision: 200 });
const D34 = Decimal.clone({ precision: 34, rounding: Decimal.ROUND_HALF_EVEN });
const plain = (d: Decimal) => (d.isZero() ? '0' : d.toFixed());
type Set = { id: string; corrections: { element: string; slope: string; offset: string }[] };

const BURNS = [
  { C: 0.452, Mn: 0.744, Cr: 0.11 },
  { C: 0.449, Mn: 0.751, Cr: '<0.002' },
  { C: 0.455, Mn: 0.755, Cr: 0.12 },
];
const push = (code: string, burns: { values: Record<string, number | string>; measured_at?: string }[]) =>
  s.analyst
    .post('/api/v1/samples')
    .send({ sample_code: code, heat: code.slice(0, 8), instrument_id: s.lab.foundry.id, method_id: s.method.id, burns });
const storedBurns = (sampleId: string) => s.t.db('burns').where({ sample_id: sampleId }).orderBy('burn_number');
const storedSample = (sampleId: string) => s.t.db('samples').where({ id: sampleId }).first();

/** The exact value α·x + β of one element under a set (independent of the server's code). */
function expected(set: Set, element: string, x: string): string {
  const c = set.corrections.find((e) => e.element === element)!;
  return plain(new D200(c.slope).times(x).plus(c.offset));
}

let before: { id: string; body: unknown };
let set: Set;

describe('applying the correction set in force', () => {
  it('leaves samples uncorrected while no set is in force', async () => {
    const res = await push(
      'K24-0801-F1',
      BURNS.map((values) => ({ values })),
    );
    expect(res.status).toBe(201);
    expect(res.body.correction).toBeNull();
    expect(res.body.burns[0]).toMatchObject({ correction_set_id: null, values: { Mn: { corrected: null } } });
    const mn = res.body.results.find((r: { element: string }) => r.element === 'Mn');
    expect(mn.raw_mean).toBe(mn.mean);
    before = { id: res.body.id, body: (await s.viewer.get(`/api/v1/samples/${res.body.id}`)).body };
  });

  it('corrects every burn pushed after activation by exactly α·x + β per element, records the set, and leaves earlier samples untouched', async () => {
    set = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.95)));
    await activate(s, set.id);
    const res = await push(
      'K24-0802-F1',
      BURNS.map((values) => ({ values })),
    );
    expect(res.body.correction).toEqual({
      set_id: set.id,
      set_ids: [set.id],
      applied_to: 'concentration',
      selection: 'measurement_time',
      reason: null,
      recomputed_by: null,
      recomputed_at: null,
    });
    const burns = await storedBurns(res.body.id);
    for (const [i, burn] of burns.entries()) {
      expect(burn.correction_set_id).toBe(set.id);
      const values = JSON.parse(burn.values_json);
      const corrected = JSON.parse(burn.corrected_json);
      for (const element of ['C', 'Mn', 'Cr']) {
        expect(corrected[element]).toEqual({ v: expected(set, element, values[element].v), q: values[element].q });
      }
      expect(res.body.burns[i].values.Mn.corrected).toEqual({ value: Number(expected(set, 'Mn', values.Mn.v)), qualifier: null });
    }
    // The stored mean is the exact mean of the corrected burns (34 digits, half-even); raw_mean that of the measured ones.
    const results = JSON.parse((await storedSample(res.body.id)).results_json);
    const mn = results.find((r: { element: string }) => r.element === 'Mn');
    const correctedMn = BURNS.map((b) => expected(set, 'Mn', String(b.Mn)));
    expect(mn.mean).toBe(plain(correctedMn.reduce((sum, v) => sum.plus(v), new D34(0)).div(3)));
    expect(mn.raw_mean).toBe(plain(BURNS.reduce((sum, b) => sum.plus(String(b.Mn)), new D34(0)).div(3)));
    // A "<" bound is corrected like a value: α·0.002 + β.
    expect(JSON.parse(burns[1].corrected_json).Cr).toEqual({ v: expected(set, 'Cr', '0.002'), q: '<' });
    // The sample stored before the activation reads exactly as it did.
    expect((await s.viewer.get(`/api/v1/samples/${before.id}`)).body).toEqual(before.body);
  });

  it('corrects an imported file the same way', async () => {
    const csv = [
      'Sample,Heat,Burn,C %,Mn %,Cr %',
      'K24-0803-F1,K24-0803,1,0.452,0.744,0.11',
      'K24-0803-F1,K24-0803,2,0.449,0.751,0.12',
      '',
    ].join('\n');
    const res = await s.analyst
      .post('/api/v1/imports')
      .field('instrument_id', s.lab.foundry.id)
      .field('method_id', s.method.id)
      .attach('file', Buffer.from(csv), 'after.csv');
    expect(res.status).toBe(201);
    const sampleId = res.body.report.sample_ids[0];
    for (const burn of await storedBurns(sampleId)) {
      const values = JSON.parse(burn.values_json);
      const corrected = JSON.parse(burn.corrected_json);
      for (const element of ['C', 'Mn', 'Cr']) expect(corrected[element].v).toBe(expected(set, element, values[element].v));
    }
    expect((await s.viewer.get(`/api/v1/samples/${sampleId}`)).body.correction.set_id).toBe(set.id);
  });

  it("chooses the set by each burn's measurement time", async () => {
    const between = new Date().toISOString();
    const second = await createRun(s, twoPointRun(s, burnsAt('high', 1.02), burnsAt('low', 1.01)));
    await activate(s, second.id);
    const longAgo = new Date(Date.now() - 30 * 24 * 3600_000).toISOString();
    const res = await push('K24-0804-F1', [
      { values: BURNS[0], measured_at: longAgo },
      { values: BURNS[2], measured_at: between },
      { values: BURNS[2] },
    ]);
    expect(res.body.burns.map((b: { correction_set_id: string | null }) => b.correction_set_id)).toEqual([null, set.id, second.id]);
    expect(res.body.correction).toMatchObject({ set_id: null, set_ids: [set.id, second.id], selection: 'measurement_time' });
    expect(res.body.burns[0].values.Mn.corrected).toBeNull();
  });

  it("keeps each burn's correction when a burn is excluded", async () => {
    const res = await push(
      'K24-0805-F1',
      BURNS.map((values) => ({ values })),
    );
    const excluded = await s.analyst.patch(`/api/v1/samples/${res.body.id}/burns/3`).send({ excluded: true, reason: 'spark on a pore' });
    expect(excluded.status).toBe(200);
    const results = JSON.parse((await storedSample(res.body.id)).results_json);
    const burns = await storedBurns(res.body.id);
    const correctedMn = burns.slice(0, 2).map((b) => JSON.parse(b.corrected_json).Mn.v);
    expect(results.find((r: { element: string }) => r.element === 'Mn').mean).toBe(
      plain(correctedMn.reduce((sum: Decimal, v: string) => sum.plus(v), new D34(0)).div(2)),
    );
    expect(excluded.body.correction.set_ids).toEqual(res.body.correction.set_ids);
  });
});
