import fc from 'fast-check';
import { Decimal } from 'decimal.js';
import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { computeElementResult, type BurnCell } from '../../../server/domain/chemistry/element-result.ts';
import { convertResult, reportingDecimals } from '../../../server/domain/chemistry/result-units.ts';
import { roundHalfEven } from '../../../server/domain/chemistry/rounding.ts';
import { fromPercent } from '../../../server/domain/chemistry/units.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

const num = (value: string): BurnCell => ({ value, qualifier: null });

describe('reportingDecimals (the same place in another unit, 1 % = 10^4 ppm = 10^7 ppb, NIST SP 811 §7.10; never coarser than a whole ppm/ppb)', () => {
  it.each([
    [4, 'ppm', 0],
    [5, 'ppm', 1],
    [2, 'ppm', 0],
    [4, 'ppb', 0],
    [7, 'ppb', 0],
    [6, 'ppm', 2],
    [3, '%', 3],
  ] as const)('%i decimals in %% → %s with %i decimals', (decimals, unit, expected) => {
    expect(reportingDecimals(decimals, unit)).toBe(expected);
  });
});

describe('convertResult', () => {
  const burns = [num('0.0725'), num('0.0731'), num('0.0722')];

  it('converts mean, min, max and SD exactly, leaves RSD and n alone', () => {
    const inPercent = computeElementResult({ element: 'Cr', cells: burns, settings: { decimals: 4, repeatability_sd: '0.0005' } });
    const ppm = convertResult(inPercent, 'ppm', 4);
    expect(ppm.unit).toBe('ppm');
    expect(ppm.mean).toBe('726'); // (0.0725 + 0.0731 + 0.0722) / 3 = 0.0726 % = 726 mg/kg
    expect(ppm.min).toBe('722');
    expect(ppm.max).toBe('731');
    expect(ppm.sd).toBeCloseTo((inPercent.sd as number) * 10_000, 9);
    expect(ppm.rsd).toBe(inPercent.rsd);
    expect(ppm.n).toBe(3);
    expect(ppm.repeatability).toEqual({ range: '9', critical_range: '16.55', exceeded: false });
  });

  it('scales the SD without float noise (0.07 % → exactly 700 ppm; 0.07 × 10000 is 700.0000000000001)', () => {
    expect(0.07 * 10_000).not.toBe(700);
    const base = computeElementResult({ element: 'Cr', cells: [num('0.07')], settings: { decimals: 2 } });
    expect(convertResult({ ...base, sd: 0.07 }, 'ppm', 2).sd).toBe(700);
  });

  it('re-rounds reported from the full mean: 4 decimals in % = 0 in ppm', () => {
    const r = computeElementResult({ element: 'Cr', cells: [num('0.07255'), num('0.07256')], settings: { decimals: 4 } });
    expect(r.reported).toBe('0.0726');
    expect(convertResult(r, 'ppm', 4).reported).toBe('726');
    expect(convertResult(r, 'ppb', 4).reported).toBe('725550'); // whole ppb, from the mean in ppb
  });

  it('rounds from the mean in ppm at whole ppm, not the % rounding scaled (Si 0.5943 % → "0.59" %, "5943" ppm, never "5900")', () => {
    const si = computeElementResult({ element: 'Si', cells: [num('0.5941'), num('0.5945')], settings: { decimals: 2 } });
    expect(si.reported).toBe('0.59');
    expect(convertResult(si, 'ppm', 2)).toMatchObject({ mean: '5943', reported: '5943', unit: 'ppm' });
    expect(reportingDecimals(2, 'ppm')).toBe(0);
  });

  it('breaks ties half to even in ppm (ASTM E29 §6.4: 725.5 → 726, 724.5 → 724; decimal.js ROUND_HALF_EVEN agrees)', () => {
    const up = computeElementResult({ element: 'Cr', cells: [num('0.07255')], settings: { decimals: 2 } });
    const down = computeElementResult({ element: 'Cr', cells: [num('0.07245')], settings: { decimals: 2 } });
    expect(convertResult(up, 'ppm', 2).reported).toBe('726');
    expect(convertResult(down, 'ppm', 2).reported).toBe('724');
    expect(new Decimal('724.5').toDecimalPlaces(0, Decimal.ROUND_HALF_EVEN).toFixed(0)).toBe('724');
  });

  it('keeps one decimal in ppm for 5 decimals in %, from the full mean', () => {
    const r = computeElementResult({ element: 'B', cells: [num('0.000123449')], settings: { decimals: 5 } });
    expect(r.reported).toBe('0.00012');
    expect(convertResult(r, 'ppm', 5).reported).toBe('1.2');
    expect(convertResult(r, 'ppm', 5).mean).toBe('1.23449');
  });

  it('scales a "<" bound exactly, with the decimals of the unit', () => {
    const r = computeElementResult({ element: 'Pb', cells: [num('0.0001')], settings: { decimals: 4, detection_limit: '0.0005' } });
    expect(r).toMatchObject({ reported: '0.0005', qualifier: '<' });
    expect(convertResult(r, 'ppm', 4)).toMatchObject({ reported: '5', qualifier: '<' });
    const coarse = computeElementResult({ element: 'Pb', cells: [{ value: '0.0005', qualifier: '<' }], settings: { decimals: 3 } });
    expect(coarse.reported).toBe('0.001');
    expect(convertResult(coarse, 'ppm', 3).reported).toBe('10');
    expect(convertResult(coarse, 'ppb', 3).reported).toBe('10000');
  });

  it('returns % unchanged, and keeps nulls null', () => {
    const r = computeElementResult({ element: 'Pb', cells: [], settings: { decimals: 4 } });
    expect(convertResult(r, '%', 4)).toEqual({ ...r, unit: '%' });
    expect(convertResult(r, 'ppm', 4)).toMatchObject({ mean: null, sd: null, min: null, max: null, reported: null, unit: 'ppm' });
  });

  it('rounds the mean in the unit with decimal.js half-even, within half a % step of the % value scaled (property)', () => {
    // The reported value is the mean in the unit rounded half-even (decimal.js ROUND_HALF_EVEN) at
    // max(0, d − k) decimals. Where that is the same place as d decimals in %, it equals the %
    // string scaled (scaling by 10^k moves the decimal point); where it is finer, the two differ by
    // at most half a % step. The mean is checked against js-quantities.
    const decimal = decimalString({ maxDigits: 10n ** 9n, maxScale: 9 }).filter((value) => Number(value) > 0);
    fc.assert(
      fc.property(
        fc.array(decimal, { minLength: 1, maxLength: 5 }),
        fc.integer({ min: 0, max: 7 }),
        fc.constantFrom('ppm' as const, 'ppb' as const),
        (values, decimals, unit) => {
          const r = computeElementResult({ element: 'Mn', cells: values.map(num), settings: { decimals } });
          const converted = convertResult(r, unit, decimals);
          const shift = unit === 'ppm' ? 4 : 7;
          const places = Math.max(0, decimals - shift);
          const inUnit = new Decimal(fromPercent(r.mean as string, unit));
          expect(converted.reported).toBe(inUnit.toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toFixed(places));
          expect(converted.reported).toBe(roundHalfEven(inUnit.toFixed(), places));
          const scaledPercent = new Decimal(fromPercent(r.reported as string, unit));
          const halfStep = new Decimal(10).pow(shift - decimals).div(2);
          if (decimals >= shift) expect(converted.reported).toBe(scaledPercent.toFixed(places));
          else expect(new Decimal(converted.reported as string).minus(scaledPercent).abs().lte(halfStep)).toBe(true);
          const theirs = Qty(`${Number(r.mean)} %`).to(unit).scalar; // js-quantities 1.8.0 (doubles)
          expect(Math.abs(Number(converted.mean) - theirs)).toBeLessThanOrEqual(1e-12 * theirs);
        },
      ),
      { numRuns: 500 },
    );
  });
});
