// Standardization runs through the API: per-element corrections checked against decimal.js,
// flags that explain themselves, H = L → 422 naming the element, references that do not fit the
// mode, the standardization.flagged event, lists.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { expectProblem, problemBody } from '../../helpers/test-app.ts';
import { burnsAt, createRun, NOMINAL, twoPointRun, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();

const url = () => `/api/v1/instruments/${s.lab.foundry.id}/standardizations`;
const D60 = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });
const D200 = Decimal.clone({ precision: 200 });

describe('POST /api/v1/instruments/{id}/standardizations', () => {
  it('computes the two-point correction of each element as decimal.js does, as a draft', async () => {
    const high = [
      { C: 0.795, Mn: 1.468, Cr: 2.11 },
      { C: 0.799, Mn: 1.471, Cr: 2.12 },
      { C: 0.797, Mn: 1.474, Cr: 2.13 },
    ];
    const low = [
      { C: 0.104, Mn: 0.301, Cr: 0.247 },
      { C: 0.103, Mn: 0.303, Cr: 0.249 },
      { C: 0.105, Mn: 0.302, Cr: 0.248 },
    ];
    const res = await s.analyst
      .post(url())
      .send(twoPointRun(s, high, low, { measured_at: '2026-03-02T06:10:00+01:00', note: 'morning standardization' }));
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/api/v1/standardizations/${res.body.id}`);
    expect(res.body).toMatchObject({
      status: 'draft',
      mode: 'two_point',
      flag: 'ok',
      in_force: false,
      activation: null,
      measured_at: '2026-03-02T05:10:00.000Z',
      instrument: { code: 'OES-1' },
      method: { id: s.method.id },
    });
    expect(res.body.corrections.map((c: { element: string }) => c.element)).toEqual(['C', 'Mn', 'Cr']);
    // Independent oracle (decimal.js): H and L are the exact means of the burns; α rounded to 20 significant digits, β to 20 decimals.
    for (const element of ['C', 'Mn', 'Cr'] as const) {
      const mean = (burns: Record<string, number>[]) => burns.reduce((sum, b) => sum.plus(String(b[element])), new D60(0)).div(3);
      const H = mean(high);
      const L = mean(low);
      const slope = new D60(NOMINAL.high[element])
        .minus(NOMINAL.low[element])
        .div(H.minus(L))
        .toSignificantDigits(20, Decimal.ROUND_HALF_EVEN);
      const row = res.body.corrections.find((c: { element: string }) => c.element === element);
      expect(row.slope).toBe(slope.toFixed());
      const offset = new D200(NOMINAL.low[element])
        .minus(new D200(slope).times(L.toSignificantDigits(34, Decimal.ROUND_HALF_EVEN)))
        .toDecimalPlaces(20, Decimal.ROUND_HALF_EVEN);
      expect(row.offset).toBe(offset.toFixed());
      expect(row).toMatchObject({ flag: 'ok', reasons: [], previous_slope: null, previous_offset: null });
      expect(row.levels).toEqual([
        {
          reference_material_id: s.high.id,
          code: s.high.code,
          kind: 'high',
          nominal: NOMINAL.high[element],
          measured: H.toSignificantDigits(34, Decimal.ROUND_HALF_EVEN).toFixed(),
          n: 3,
        },
        {
          reference_material_id: s.low.id,
          code: s.low.code,
          kind: 'low',
          nominal: NOMINAL.low[element],
          measured: L.toSignificantDigits(34, Decimal.ROUND_HALF_EVEN).toFixed(),
          n: 3,
        },
      ]);
    }
    expect(res.body.measurements[0].burns[1].values.Mn).toEqual({ value: '1.471', qualifier: null, raw: '1.471', raw_unit: '%' });
    expect(await s.t.db('events').where({ type: 'standardization.flagged' })).toHaveLength(0);
  });

  it('answers 422 naming the element when H = L, and stores nothing', async () => {
    const before = (await s.t.db('standardizations').count({ n: '*' }))[0].n;
    const high = burnsAt('high', 1).map((b) => ({ ...b, Mn: 0.75 }));
    const low = burnsAt('low', 1).map((b) => ({ ...b, Mn: 0.75 }));
    const res = await s.analyst.post(url()).send(twoPointRun(s, high, low));
    expectProblem(res, 422);
    expect(problemBody(res).detail).toBe('No correction can be computed for Mn; see errors[].');
    expect(problemBody(res).errors).toEqual([
      {
        location: 'body.measurements.Mn',
        message: 'Mn: the high and low references measured the same value (H = L = 0.75 %), so no slope can be computed.',
        code: 'no_correction',
      },
    ]);
    expect((await s.t.db('standardizations').count({ n: '*' }))[0].n).toBe(before);
  });

  it('flags a slope beyond the limits, a missing element and disagreeing burns, each with its reason, and records standardization.flagged', async () => {
    const high = burnsAt('high', 1).map((b, i) => ({ ...b, C: [0.605, 0.61, 0.615][i], Cr: [2.1, 2.16, 2.2][i] }));
    const low = burnsAt('low', 1).map(({ Mn: _mn, ...b }) => b);
    const run = await createRun(s, twoPointRun(s, high, low));
    const by = (el: string) => run.corrections.find((c) => c.element === el)!;
    expect(run.flag).toBe('warn');
    // C: α = (0.812 − 0.105)/(0.61 − 0.105) = 1.4 → 0.4 from 1: warn (above 0.2, not above 0.5).
    expect(by('C').flag).toBe('warn');
    expect(by('C').reasons).toEqual([
      expect.stringMatching(/^Slope 1\.4 is 0\.4 away from 1: more than the warn limit 0\.2 of method FE-T\d+ \(fail above 0\.5\)\.$/),
    ]);
    expect(by('Mn')).toMatchObject({ slope: null, offset: null, flag: 'warn' });
    expect(by('Mn').reasons).toEqual([
      `${s.low.code} has no numeric measurement of Mn (not measured, or only "<", ">" or n.d.). Mn is therefore not corrected by this set: its results stay uncorrected while the set is in force.`,
    ]);
    // Cr burns 2.10, 2.16, 2.20: range 0.10 > f(3)·σr = 3.31 × 0.01 = 0.0331 (ISO 5725-6 Table 1).
    expect(by('Cr').flag).toBe('warn');
    expect(by('Cr').reasons).toEqual([
      expect.stringContaining(
        `The 3 burns of ${s.high.code} disagree: their range 0.1 % exceeds the ISO 5725-6 critical range f(3)·σr = 0.0331 %`,
      ),
    ]);
    const events = await s.t.db('events').where({ type: 'standardization.flagged' });
    expect(events).toHaveLength(1);
    expect(JSON.parse(events[0].data_json)).toMatchObject({
      standardization: { id: run.id, flag: 'warn' },
      elements: [{ element: 'C' }, { element: 'Mn' }, { element: 'Cr' }],
    });
  });

  it('refuses references that do not fit the mode, with each problem located', async () => {
    const oneRef = {
      method_id: s.method.id,
      mode: 'two_point',
      measurements: [{ reference_material_id: s.high.id, burns: [{ values: { Mn: 1.5 } }] }],
    };
    const res = await s.analyst.post(url()).send(oneRef);
    expectProblem(res, 422);
    expect(problemBody(res).errors?.map((e) => e.location)).toEqual(['body.measurements']);

    const alRef = await s.analyst
      .post('/api/v1/reference-materials')
      .send({ code: 'T-AL-HI', name: 'Al high', matrix: 'Al', kind: 'high', values: [{ element: 'Mn', nominal: '0.9' }] });
    const mixed = twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1));
    mixed.measurements[0].reference_material_id = alRef.body.id;
    const wrong = await s.analyst.post(url()).send(mixed);
    expectProblem(wrong, 422);
    expect(problemBody(wrong).errors).toEqual(
      expect.arrayContaining([expect.objectContaining({ location: 'body.measurements.0.reference_material_id', code: 'matrix_mismatch' })]),
    );

    const unknown = await s.analyst.post(url()).send({ ...twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1)), method_id: 'mth_nope' });
    expectProblem(unknown, 422);
    expect(problemBody(unknown).errors?.[0].location).toBe('body.method_id');
    expectProblem(
      await s.analyst.post('/api/v1/instruments/ins_nope/standardizations').send(twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1))),
      404,
    );
  });

  it('answers 400 for unreadable burn values and unknown modes, naming each field', async () => {
    const res = await s.analyst.post(url()).send(twoPointRun(s, [{ Mn: 'abc' }], [{ Xx: 0.3 }]));
    expectProblem(res, 400);
    expect(
      problemBody(res)
        .errors?.map((e) => e.location)
        .sort(),
    ).toEqual(['body.measurements.0.burns.0.values.Mn', 'body.measurements.1.burns.0.values.Xx']);
    const mode = await s.analyst.post(url()).send({ ...twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1)), mode: 'three_point' });
    expectProblem(mode, 400);
    expect(problemBody(mode).errors?.[0].location).toBe('body.mode');
  });

  it('computes one-point and type corrections', async () => {
    const factor = await createRun(s, {
      method_id: s.method.id,
      mode: 'one_point_factor',
      measurements: [{ reference_material_id: s.high.id, burns: [{ values: { C: 0.8, Mn: 1.5, Cr: 2.0 } }] }],
    });
    expect(factor.corrections.find((c) => c.element === 'Cr')).toMatchObject({ slope: '1.075', offset: '0' }); // 2.15 / 2.0
    const offset = await createRun(s, {
      method_id: s.method.id,
      mode: 'one_point_offset',
      measurements: [{ reference_material_id: s.low.id, burns: [{ values: { C: 0.1, Mn: 0.3, Cr: 0.25 } }] }],
    });
    expect(offset.corrections.find((c) => c.element === 'Mn')).toMatchObject({ slope: '1', offset: '0.005' }); // 0.305 − 0.3
    const typeRes = await s.analyst.post(url()).send({
      method_id: s.method.id,
      mode: 'type',
      measurements: [{ reference_material_id: s.high.id, burns: [{ values: { Mn: 1.5 } }] }],
    });
    expectProblem(typeRes, 422);
    expect(problemBody(typeRes).errors?.[0]).toMatchObject({ location: 'body.measurements.0.reference_material_id', code: 'wrong_kind' });
  });

  it("lists an instrument's runs newest first, pages them, and reads one; viewers may read", async () => {
    const list = await s.viewer.get(url()).query({ limit: 2 });
    expect(list.status).toBe(200);
    expect(list.body.data).toHaveLength(2);
    const times = list.body.data.map((r: { measured_at: string }) => r.measured_at);
    expect([...times].sort().reverse()).toEqual(times);
    const next = await s.viewer.get(url()).query({ limit: 2, cursor: list.body.next_cursor });
    expect(next.body.data[0].id).not.toBe(list.body.data[1].id);
    const one = await s.viewer.get(`/api/v1/standardizations/${list.body.data[0].id}`);
    expect(one.body).toEqual(list.body.data[0]);
    expectProblem(await s.viewer.get('/api/v1/standardizations/std_nope'), 404);
    expectProblem(await s.viewer.post(url()).send(twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1))), 403);
  });

  it("flags against the method's own drift limits (defaults 0.2 / 0.5), which a manager sets", async () => {
    const method = await s.viewer.get(`/api/v1/methods/${s.method.id}`);
    expect(method.body.drift_limits).toEqual({
      warn: '0.2',
      fail: '0.5',
      slope_change_warn: '0.05',
      slope_change_fail: '0.15',
      second_person_activation: false,
    });
    const bad = await s.manager.patch(`/api/v1/methods/${s.method.id}`).send({ drift_limits: { warn: '0.3', fail: '0.1' } });
    expectProblem(bad, 400);
    expect(problemBody(bad).errors?.[0].location).toBe('body.drift_limits.fail');
    const changed = await s.manager.patch(`/api/v1/methods/${s.method.id}`).send({ drift_limits: { warn: '0.01', fail: '0.02' } });
    expect(changed.body.drift_limits).toEqual({
      warn: '0.01',
      fail: '0.02',
      slope_change_warn: '0.05',
      slope_change_fail: '0.15',
      second_person_activation: false,
    });
    // Every level read 3 % low → α ≈ 1/0.97 ≈ 1.031: beyond the fail limit 0.02.
    const run = await createRun(s, twoPointRun(s, burnsAt('high', 0.97), burnsAt('low', 0.97)));
    expect(run.corrections.map((c) => c.flag)).toEqual(['fail', 'fail', 'fail']);
    expect(run.corrections[1].reasons[0]).toMatch(/more than the fail limit 0\.02 of method FE-T\d+/);
    await s.manager.patch(`/api/v1/methods/${s.method.id}`).send({ drift_limits: { warn: '0.2', fail: '0.5' } });
  });
});
