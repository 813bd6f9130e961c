// Flags on a standardization element: limits on |α − 1| (defaults 0.2/0.5: common practice, no
// source), negative slopes, levels too close, and disagreeing reference burns (ISO 5725-6 §5.2).
import { describe, expect, it } from 'vitest';
import { repeatabilityCheck } from '../../../server/domain/chemistry/repeatability.ts';
import { agreementFlag, changeFlag, limitFlags, spanFlag, worstFlag } from '../../../server/domain/drift/correction-flags.ts';

const LIMITS = { warn: '0.2', fail: '0.5', slope_change_warn: '0.05', slope_change_fail: '0.15', second_person_activation: false };

describe('slope limits', () => {
  it('passes a distance equal to a limit and flags anything beyond it', () => {
    expect(limitFlags('two_point', { slope: '1.2', offset: '0' }, LIMITS, 'FE-LA')).toEqual([]);
    expect(limitFlags('two_point', { slope: '0.8', offset: '0' }, LIMITS, 'FE-LA')).toEqual([]);
    const warn = limitFlags('two_point', { slope: '1.2000001', offset: '0' }, LIMITS, 'FE-LA');
    expect(warn).toEqual([
      { flag: 'warn', reason: 'Slope 1.2 is 0.2 away from 1: more than the warn limit 0.2 of method FE-LA (fail above 0.5).' },
    ]);
    expect(limitFlags('two_point', { slope: '1.5', offset: '0' }, LIMITS, 'FE-LA').map((f) => f.flag)).toEqual(['warn']);
    const fail = limitFlags('one_point_factor', { slope: '0.4512', offset: '0' }, LIMITS, 'FE-LA');
    expect(fail).toEqual([
      {
        flag: 'fail',
        reason: 'Slope 0.4512 is 0.5488 away from 1: more than the fail limit 0.5 of method FE-LA. Activating it needs an override reason.',
      },
    ]);
  });

  it("uses the method's own limits", () => {
    expect(
      limitFlags('two_point', { slope: '1.06', offset: '0' }, { ...LIMITS, warn: '0.05', fail: '0.1' }, 'AL-WR').map((f) => f.flag),
    ).toEqual(['warn']);
    expect(
      limitFlags('two_point', { slope: '1.11', offset: '0' }, { ...LIMITS, warn: '0.05', fail: '0.1' }, 'AL-WR').map((f) => f.flag),
    ).toEqual(['fail']);
  });

  it('fails a negative slope and says the references look swapped', () => {
    const flags = limitFlags('two_point', { slope: '-0.98', offset: '1.2' }, LIMITS, 'FE-LA');
    expect(flags.map((f) => f.flag)).toEqual(['fail', 'fail']);
    expect(flags[0].reason).toMatch(/negative.*swapped/);
  });

  it('judges a one-point offset relative to the nominal value', () => {
    expect(limitFlags('one_point_offset', { slope: '1', offset: '0.05' }, LIMITS, 'FE-LA', { nominal: '0.5', measured: '0.45' })).toEqual(
      [],
    );
    const flags = limitFlags('one_point_offset', { slope: '1', offset: '0.15' }, LIMITS, 'FE-LA', { nominal: '0.5', measured: '0.35' });
    expect(flags).toEqual([
      {
        flag: 'warn',
        reason:
          'Offset 0.15 % moves the reference by 30 % of its nominal value 0.5 %: more than the warn limit 0.2 of method FE-LA (fail above 0.5).',
      },
    ]);
  });
});

describe('other checks', () => {
  it('warns when the measured levels are closer than 10 % of the higher one', () => {
    expect(spanFlag({ nominal: '0.80', measured: '0.79' }, { nominal: '0.72', measured: '0.74' }, 'HI', 'LO')?.reason).toBe(
      'The measured levels are close: HI 0.79 % and LO 0.74 % differ by 0.05 %, less than 10 % of the higher level, so burn-to-burn noise moves the slope a lot. Use references further apart.',
    );
    expect(spanFlag({ nominal: '1.5', measured: '1.47' }, { nominal: '0.3', measured: '0.31' }, 'HI', 'LO')).toBeNull();
  });

  it("warns when a reference's burns exceed the ISO 5725-6 critical range", () => {
    // f(2) = 2.77 (ISO 5725-6 Table 1; jstat), σr = 0.005 → critical range 0.01385 < range 0.02 (shown half-even to 4 decimals: 0.0138).
    const check = repeatabilityCheck(['0.70', '0.72'], '0.005');
    expect(agreementFlag(check, 2, '0.005', 'KB-FE-HI')).toEqual({
      flag: 'warn',
      reason:
        'The 2 burns of KB-FE-HI disagree: their range 0.02 % exceeds the ISO 5725-6 critical range f(2)·σr = 0.0138 % (σr 0.005 %). Spark it again before relying on this correction.',
    });
    expect(agreementFlag(repeatabilityCheck(['0.70', '0.71'], '0.005'), 2, '0.005', 'KB-FE-HI')).toBeNull();
  });

  it('takes the worst flag', () => {
    expect(worstFlag([])).toBe('ok');
    expect(worstFlag(['ok', 'warn'])).toBe('warn');
    expect(worstFlag(['warn', 'fail', 'ok'])).toBe('fail');
  });

  it('compares the slope with the set before: |α / α_previous − 1| against 5 % and 15 %, a move equal to a limit passing', () => {
    // 1.05 / 1 − 1 = 0.05 exactly: equal to the warn limit, so it passes (by hand).
    expect(changeFlag('1.05', '1', LIMITS, 'FE-LA')).toBeNull();
    // 1.08 / 1 − 1 = 0.08: the 8 % move the drift chart once showed as OK.
    expect(changeFlag('1.08', '1', LIMITS, 'FE-LA')).toEqual({
      flag: 'warn',
      reason: 'Slope 1.08 moved +8 % from 1 of the set before: more than the 5 % method FE-LA expects between runs (fail above 15 %).',
    });
    // 0.85 / 1.02 − 1 = −0.16666…: a fall of 16.7 %.
    expect(changeFlag('0.85', '1.02', LIMITS, 'FE-LA')?.reason).toMatch(
      /^Slope 0\.85 moved −16\.7 % from 1\.02 of the set before: more than the 15 % method FE-LA allows between runs\./,
    );
    expect(changeFlag('0.85', '1.02', LIMITS, 'FE-LA')?.flag).toBe('fail');
    expect(changeFlag('1.5', null, LIMITS, 'FE-LA')).toBeNull();
    expect(changeFlag('1.5', '1', { ...LIMITS, slope_change_warn: null, slope_change_fail: null }, 'FE-LA')).toBeNull();
  });
});
