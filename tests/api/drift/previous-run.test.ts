// Runs compared with the set before (the set in force at the run's measurement time): slope_change
// and offset_change on each element, and the method's slope_change_warn / slope_change_fail limits
// (defaults 5 % and 15 %), which a manager sets per method or switches off with null.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { expectProblem } from '../../helpers/test-app.ts';
import { activate, burnsAt, createRun, twoPointRun, useDriftSetup } from './drift-setup.ts';

const s = useDriftSetup();
const D = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });

describe('comparing a run with the set before', () => {
  it('gives the change of slope and offset per element, and warns when the slope moved more than 5 %', async () => {
    const first = await createRun(s, twoPointRun(s, burnsAt('high', 1), burnsAt('low', 1)));
    await activate(s, first.id);
    // Every level read 7 % low: α ≈ 1/0.93 ≈ 1.075, a move of about +7.5 % from ≈ 1.
    const next = (
      await s.analyst
        .get(`/api/v1/standardizations/${(await createRun(s, twoPointRun(s, burnsAt('high', 0.93), burnsAt('low', 0.93)))).id}`)
        .expect(200)
    ).body;
    for (const c of next.corrections) {
      // Oracle: decimal.js on the returned strings (α / α_previous − 1 to 20 significant digits; β − β_previous exactly).
      expect(c.slope_change).toBe(new D(c.slope).div(c.previous_slope).minus(1).toSignificantDigits(20).toFixed());
      expect(c.offset_change).toBe(new D(c.offset).minus(c.previous_offset).toFixed());
      expect(Number(c.slope_change)).toBeGreaterThan(0.05);
      expect(c.flag).toBe('warn');
      expect(c.reasons).toEqual([
        expect.stringMatching(
          new RegExp(
            `^Slope 1\\.07\\d* moved \\+7\\.\\d % from 1(\\.\\d+)? of the set before: more than the 5 % method ${s.method.code} expects between runs \\(fail above 15 %\\)\\.$`,
          ),
        ),
      ]);
    }
    // The first run of an instrument has nothing to compare with.
    expect(first.corrections.every((c) => c.previous_slope === null)).toBe(true);
    const firstView = (await s.analyst.get(`/api/v1/standardizations/${first.id}`)).body;
    expect(firstView.corrections.map((c: { slope_change: string | null }) => c.slope_change)).toEqual([null, null, null]);
  });

  it("fails above the method's slope_change_fail, so that activation needs an override; null switches the check off", async () => {
    const limits = (changes: Record<string, string | null>) =>
      s.manager.patch(`/api/v1/methods/${s.method.id}`).send({ drift_limits: { warn: '0.2', fail: '0.5', ...changes } });
    const bad = await limits({ slope_change_warn: '0.1', slope_change_fail: '0.05' });
    expectProblem(bad, 400);
    expect(bad.body.errors[0].location).toBe('body.drift_limits.slope_change_fail');

    expect((await limits({ slope_change_warn: '0.02', slope_change_fail: '0.06' })).status).toBe(200);
    const failing = await createRun(s, twoPointRun(s, burnsAt('high', 0.93), burnsAt('low', 0.93)));
    expect(failing.corrections.map((c) => c.flag)).toEqual(['fail', 'fail', 'fail']);
    expect(failing.corrections[0].reasons[0]).toMatch(/more than the 6 % method FE-T\d+ allows between runs/);
    const refused = await s.manager.post(`/api/v1/standardizations/${failing.id}/activate`).send({});
    expectProblem(refused, 409);

    expect((await limits({ slope_change_warn: null, slope_change_fail: null })).body.drift_limits).toEqual({
      warn: '0.2',
      fail: '0.5',
      slope_change_warn: null,
      slope_change_fail: null,
      second_person_activation: false,
    });
    const unchecked = await createRun(s, twoPointRun(s, burnsAt('high', 0.93), burnsAt('low', 0.93)));
    expect(unchecked.corrections.map((c) => c.flag)).toEqual(['ok', 'ok', 'ok']);
  });
});
