import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  CRITICAL_RANGE_FACTORS,
  criticalRangeFactor,
  rangeCheck,
  repeatabilityCheck,
} from '../../../server/domain/chemistry/repeatability.ts';

// ISO 5725-6:1994 Table 1, critical range factors f(n) to one decimal. n = 2…6 as listed in
// docs/references.md#repeatability (read); n = 7…20 from memory.
const ISO_5725_6_TABLE_1: Record<number, number> = {
  2: 2.8,
  3: 3.3,
  4: 3.6,
  5: 3.9,
  6: 4.0,
  7: 4.2,
  8: 4.3,
  9: 4.4,
  10: 4.5,
  11: 4.6,
  12: 4.6,
  13: 4.7,
  14: 4.7,
  15: 4.8,
  16: 4.8,
  17: 4.9,
  18: 4.9,
  19: 5.0,
  20: 5.0,
};

describe('ISO 5725-6 critical range factors', () => {
  const ns = Array.from({ length: 19 }, (_, i) => i + 2);

  it('has a factor for every n from 2 to 20 and none outside', () => {
    expect(Object.keys(CRITICAL_RANGE_FACTORS).map(Number)).toEqual(ns);
    expect(criticalRangeFactor(1)).toBeUndefined();
    expect(criticalRangeFactor(21)).toBeUndefined();
  });

  it.each(ns)("f(%i) is jstat's studentized range quantile q(0.95; n, ∞) to two decimals", (n) => {
    // jstat 1.9.6: jStat.tukey.inv(p, nmeans, df); df = Infinity as in docs/references.md#repeatability.
    const quantile = jStat.tukey.inv(0.95, n, Infinity);
    expect(Math.abs(Number(CRITICAL_RANGE_FACTORS[n]) - quantile)).toBeLessThanOrEqual(0.005);
    expect(CRITICAL_RANGE_FACTORS[n]).toMatch(/^\d\.\d\d$/);
  });

  it.each(ns)('f(%i) rounds to the ISO 5725-6 Table 1 value', (n) => {
    const quantile = jStat.tukey.inv(0.95, n, Infinity);
    expect(Math.round(quantile * 10) / 10).toBe(ISO_5725_6_TABLE_1[n]);
  });

  it('matches the values in docs/references.md for n = 2…6', () => {
    expect([2, 3, 4, 5, 6].map((n) => CRITICAL_RANGE_FACTORS[n])).toEqual(['2.77', '3.31', '3.63', '3.86', '4.03']);
  });

  it('f(2) is the repeatability-limit factor 1.96·√2 = 2.772 (ISO 5725)', () => {
    // For two results the studentized range reduces to √2 times the normal quantile z(0.975).
    const z = jStat.normal.inv(0.975, 0, 1);
    expect(z).toBeCloseTo(1.959964, 6);
    expect(Number(CRITICAL_RANGE_FACTORS[2])).toBeCloseTo(Math.SQRT2 * z, 2);
  });
});

describe('repeatabilityCheck', () => {
  it('flags three burns whose range exceeds 3.31·σr', () => {
    // 0.750, 0.770, 0.752 with σr 0.005: range 0.02 > 3.31 × 0.005 = 0.01655.
    expect(repeatabilityCheck(['0.750', '0.770', '0.752'], '0.005')).toEqual({ range: '0.02', critical_range: '0.01655', exceeded: true });
  });

  it('passes three burns within the critical range', () => {
    expect(repeatabilityCheck(['0.750', '0.755', '0.752'], '0.005')).toEqual({
      range: '0.005',
      critical_range: '0.01655',
      exceeded: false,
    });
  });

  it('passes a range exactly equal to the critical range and flags one just above', () => {
    expect(repeatabilityCheck(['0', '2.77'], '1')?.exceeded).toBe(false);
    expect(repeatabilityCheck(['0', '2.7700000000000000001'], '1')?.exceeded).toBe(true);
  });

  it('uses exact decimals (no float error in range or product)', () => {
    // 0.3 − 0.1 is 0.19999999999999998 in doubles; 2.77 × 0.1 is 0.27700000000000002.
    expect(repeatabilityCheck(['0.1', '0.3'], '0.1')).toEqual({ range: '0.2', critical_range: '0.277', exceeded: false });
  });

  it('does not apply to one burn, more than 20 burns, or σr ≤ 0', () => {
    expect(repeatabilityCheck(['0.75'], '0.005')).toBeNull();
    expect(
      repeatabilityCheck(
        Array.from({ length: 21 }, () => '0.75'),
        '0.005',
      ),
    ).toBeNull();
    expect(repeatabilityCheck(['0.75', '0.76'], '0')).toBeNull();
    expect(repeatabilityCheck(['0.75', '0.76'], '-0.01')).toBeNull();
    expect(repeatabilityCheck([], '0.01')).toBeNull();
  });

  it('gives the same answer from min and max (rangeCheck)', () => {
    expect(rangeCheck('0.750', '0.770', 3, '0.005')).toEqual(repeatabilityCheck(['0.770', '0.750', '0.760'], '0.005'));
    expect(rangeCheck('1e-3', '3e-3', 2, '0.0005')).toEqual({ range: '0.002', critical_range: '0.001385', exceeded: true });
  });
});
