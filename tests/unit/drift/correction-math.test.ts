// The arithmetic of drift correction, checked against decimal.js used independently here.
// Math as practised (docs/references.md#drift-correction, from memory): two-point α = (H⁰ − L⁰)/(H − L),
// β = L⁰ − α·L; one-point factor α = N/M; one-point offset β = N − M.
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { roundHalfEven } from '../../../server/domain/chemistry/rounding.ts';
import {
  correctCell,
  correctValue,
  correctValueWithDecimal,
  CorrectionMathError,
  onePointFactor,
  onePointOffset,
  twoPoint,
  typeCorrection,
} from '../../../server/domain/drift/correction-math.ts';
import type { Method } from '../../../server/domain/methods/methods.repository.ts';
import { DEFAULT_REPORTING } from '../../../server/domain/methods/methods.schemas.ts';
import { computeSampleResults } from '../../../server/domain/samples/sample-results.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

const METHOD: Method = {
  id: 'mth_test',
  code: 'T',
  name: 'test',
  matrix: 'Fe',
  default_unit: '%',
  drift_limits: { warn: '0.2', fail: '0.5', slope_change_warn: null, slope_change_fail: null, second_person_activation: false },
  reporting: DEFAULT_REPORTING,
  created_at: '',
  updated_at: '',
  elements: [
    { element: 'Mn', decimals: 3, working_range_low: null, working_range_high: null, detection_limit: null, repeatability_sd: null },
  ],
};

// The oracle: decimal.js 10.6.0 configured here — quotient at 60 digits, α kept to 20 significant
// digits and β to 20 decimal places (half-even), products and sums exact at 200 digits.
const D60 = Decimal.clone({ precision: 60, rounding: Decimal.ROUND_HALF_EVEN });
const D200 = Decimal.clone({ precision: 200 });
const plain = (d: Decimal) => (d.isZero() ? '0' : d.toFixed());
function oracleTwoPoint(h0: string, l0: string, h: string, l: string) {
  const slope = new D60(h0).minus(l0).div(new D60(h).minus(l)).toSignificantDigits(20, Decimal.ROUND_HALF_EVEN);
  const offset = new D200(l0).minus(new D200(plain(slope)).times(l)).toDecimalPlaces(20, Decimal.ROUND_HALF_EVEN);
  return { slope: plain(slope), offset: plain(offset) };
}

describe('two-point correction', () => {
  // Worked example (invented Mn levels): H⁰ = 1.502, L⁰ = 0.305; the high reference's burns
  // 1.468, 1.471, 1.474 average H = 1.471, the low reference's 0.301, 0.303, 0.302 average L = 0.302.
  const high = { nominal: '1.502', measured: '1.471' };
  const low = { nominal: '0.305', measured: '0.302' };

  it('computes α and β as decimal.js does, and as a calculator gives them', () => {
    const correction = twoPoint(high, low);
    expect(correction).toEqual(oracleTwoPoint('1.502', '0.305', '1.471', '0.302'));
    // By hand: α = 1.197 / 1.169 = 1.023952095808…, β = 0.305 − α·0.302 = −0.004233532934…
    expect(correction.slope).toBe('1.0239520958083832335');
    expect(Number(correction.offset)).toBeCloseTo(-0.004233532934, 12);
    expect(correction.slope.replace(/^-?0?\./, '').replace('.', '').length).toBeLessThanOrEqual(20);
  });

  it('corrects the measured H and L back to H⁰ and L⁰ (within 1e-12; exactly after rounding to the method decimals)', () => {
    const correction = twoPoint(high, low);
    const backHigh = correctValue(high.measured, correction);
    const backLow = correctValue(low.measured, correction);
    expect(new Decimal(backHigh).minus(high.nominal).abs().lte('1e-12')).toBe(true);
    expect(new Decimal(backLow).minus(low.nominal).abs().lte('1e-12')).toBe(true);
    expect(roundHalfEven(backHigh, 3)).toBe('1.502');
    expect(roundHalfEven(backLow, 3)).toBe('0.305');
  });

  it('round-trips any pair of levels within 1e-12 (property)', () => {
    const level = decimalString({ maxDigits: 10n ** 7n, maxScale: 5 });
    fc.assert(
      fc.property(level, level, level, level, (h0, l0, h, l) => {
        fc.pre(!new Decimal(h).eq(l) && !new Decimal(h0).eq(l0));
        const correction = twoPoint({ nominal: h0, measured: h }, { nominal: l0, measured: l });
        expect(correction).toEqual(oracleTwoPoint(h0, l0, h, l));
        // α carries 20 significant digits: the error at H is |H|·|α|·1e-20 at most, far below 1e-12 here.
        expect(new Decimal(correctValue(h, correction)).minus(h0).abs().lte('1e-12')).toBe(true);
        expect(new Decimal(correctValue(l, correction)).minus(l0).abs().lte('1e-12')).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it('refuses H = L and equal nominal values with a message naming the values', () => {
    expect(() => twoPoint({ nominal: '1.5', measured: '0.75' }, { nominal: '0.3', measured: '0.750' })).toThrow(CorrectionMathError);
    expect(() => twoPoint({ nominal: '1.5', measured: '0.75' }, { nominal: '0.3', measured: '0.750' })).toThrow(/H = L = 0\.750 %/);
    expect(() => twoPoint({ nominal: '0.3', measured: '0.8' }, { nominal: '0.30', measured: '0.2' })).toThrow(/same nominal value/);
  });
});

describe('one-point and type corrections', () => {
  it('factor α = N/M with β = 0, offset α = 1 with β = N − M (decimal.js)', () => {
    expect(onePointFactor({ nominal: '0.75', measured: '0.7' })).toEqual({
      slope: plain(new D60('0.75').div('0.7').toSignificantDigits(20, Decimal.ROUND_HALF_EVEN)),
      offset: '0',
    });
    expect(onePointOffset({ nominal: '0.75', measured: '0.7123' })).toEqual({ slope: '1', offset: '0.0377' });
    expect(() => onePointFactor({ nominal: '0.75', measured: '0' })).toThrow(CorrectionMathError);
  });

  it('a type standardization composes with the set in force and brings the type reference to its nominal value', () => {
    const base = twoPoint({ nominal: '1.502', measured: '1.471' }, { nominal: '0.305', measured: '0.302' });
    const type = typeCorrection({ nominal: '0.74', measured: '0.731' }, base);
    // t = N / (α₀·M + β₀); the set is α = t·α₀, β = t·β₀ (oracle: decimal.js here).
    const t = new D60('0.74').div(new D200(base.slope).times('0.731').plus(base.offset));
    expect(type.slope).toBe(plain(t.times(base.slope).toSignificantDigits(20, Decimal.ROUND_HALF_EVEN)));
    expect(new Decimal(correctValue('0.731', type)).minus('0.74').abs().lte('1e-12')).toBe(true);
    // Without a set in force it is a plain factor.
    expect(typeCorrection({ nominal: '0.74', measured: '0.731' }, null)).toEqual(onePointFactor({ nominal: '0.74', measured: '0.731' }));
  });
});

describe('correcting burns then averaging equals averaging then correcting', () => {
  // The mean is linear: (1/n)·Σ(α·xᵢ + β) = α·(1/n)·Σxᵢ + β. With exact decimal products the
  // sums agree digit for digit: Σ(α·xᵢ + β) = α·Σxᵢ + n·β.
  // Realistic inputs: mass fractions up to 100 % with up to 6 decimals, references measured within
  // ±40 % of their nominal values (slopes roughly 0.5–2). Then every corrected value has at most
  // ~30 digits and the 34-digit mean sums them without rounding.
  const percent = (maxScale: number) =>
    fc
      .tuple(fc.bigInt({ min: 1n, max: 100n * 10n ** BigInt(maxScale) }), fc.constant(maxScale))
      .map(([d, k]) => plain(new D200(d.toString()).div(10n ** BigInt(k) + '')));
  const measuredNear = (nominal: string, factor: number) => plain(new D200(nominal).times(factor).toDecimalPlaces(5));
  it('holds exactly on the sums and to the last of 34 digits on the means (property, decimal.js)', () => {
    const factor = fc.double({ min: 0.6, max: 1.4, noNaN: true });
    fc.assert(
      fc.property(
        fc.array(percent(6), { minLength: 1, maxLength: 50 }),
        percent(4),
        percent(4),
        factor,
        factor,
        (burns, h0, l0, fh, fl) => {
          const h = measuredNear(h0, fh);
          const l = measuredNear(l0, fl);
          fc.pre(!new Decimal(h).eq(l) && !new Decimal(h0).eq(l0));
          const slope = new Decimal(h0).minus(l0).div(new Decimal(h).minus(l)).abs();
          fc.pre(slope.gte(0.5) && slope.lte(2));
          const c = twoPoint({ nominal: h0, measured: h }, { nominal: l0, measured: l });
          const n = burns.length;
          const sumCorrected = burns.reduce((s, x) => s.plus(correctValue(x, c)), new D200(0));
          const sumRaw = burns.reduce((s, x) => s.plus(x), new D200(0));
          expect(plain(sumCorrected)).toBe(plain(new D200(c.slope).times(sumRaw).plus(new D200(c.offset).times(n))));
          const D34 = Decimal.clone({ precision: 34, rounding: Decimal.ROUND_HALF_EVEN });
          const meanThenCorrect = new D200(c.slope).times(new D200(sumRaw).div(n)).plus(c.offset); // 200 digits
          const expectedMean = plain(new D34(meanThenCorrect).toSignificantDigits(34, Decimal.ROUND_HALF_EVEN));
          expect(plain(new D34(sumCorrected).div(n))).toBe(expectedMean);
          // …and the stored result (computeSampleResults over corrected burns) is that same mean, with raw_mean uncorrected.
          const { results } = computeSampleResults(
            burns.map((x) => ({
              excluded: false,
              values: { Mn: { v: x, q: null } },
              corrected: { Mn: correctCell({ v: x, q: null }, c) },
            })),
            METHOD,
          );
          expect(results[0].mean).toBe(expectedMean);
          expect(results[0].raw_mean).toBe(plain(new D34(sumRaw).div(n)));
        },
      ),
      { numRuns: 1000 },
    );
  });
});

describe('the BigInt path of α·x + β', () => {
  it('gives exactly the strings decimal.js gives, signs and scales mixed (property)', () => {
    const signed = (maxDigits: bigint, maxScale: number) => decimalString({ maxDigits, maxScale, signs: ['', '', '-', '+'] });
    fc.assert(
      fc.property(signed(10n ** 21n, 20), signed(10n ** 21n, 20), signed(10n ** 10n, 8), (slope, offset, x) => {
        const c = { slope, offset };
        expect(correctValue(x, c)).toBe(correctValueWithDecimal(x, c));
        expect(correctValue(x, c)).toBe(plain(new D200(slope).times(x).plus(offset)));
      }),
      { numRuns: 3000 },
    );
    // Exponent notation takes the decimal.js path and still answers in plain notation.
    expect(correctValue('5e-7', { slope: '2', offset: '0' })).toBe('0.000001');
  });
});

describe('correcting one cell', () => {
  const c = { slope: '1.1', offset: '-0.01' };

  it('corrects values and "<"/">" bounds alike, keeps n.d., and flips a bound when α < 0', () => {
    expect(correctCell({ v: '0.5', q: null }, c)).toEqual({ v: '0.54', q: null });
    expect(correctCell({ v: '0.002', q: '<' }, c)).toEqual({ v: '-0.0078', q: '<' });
    expect(correctCell({ v: '1.5', q: '>' }, c)).toEqual({ v: '1.64', q: '>' });
    expect(correctCell({ v: null, q: 'nd' }, c)).toEqual({ v: null, q: 'nd' });
    expect(correctCell({ v: '0.002', q: '<' }, { slope: '-1', offset: '1' })).toEqual({ v: '0.998', q: '>' });
  });

  it('keeps a burn below 0 as it is (no clamping), reports the result as "<" a reporting step, never "-0" or an exponent', () => {
    expect(correctValue('0.001', { slope: '1', offset: '-0.003' })).toBe('-0.002');
    const shift = { slope: '1', offset: '-0.006' };
    const { results } = computeSampleResults(
      ['0.001', '0.004'].map((x) => ({
        excluded: false,
        values: { Mn: { v: x, q: null } },
        corrected: { Mn: correctCell({ v: x, q: null }, shift) },
      })),
      METHOD,
    );
    // Mean −0.0035 is kept for traceability; a mass fraction is never negative, so with no detection
    // limit set the result is "<" one step of the method's 3 decimals.
    expect(results[0]).toMatchObject({
      mean: '-0.0035',
      raw_mean: '0.0025',
      reported: '0.001',
      qualifier: '<',
      flags: ['below_zero', 'negative_after_correction'],
    });
    expect(correctValue('0.001', { slope: '1', offset: '-0.001' })).toBe('0');
    expect(correctValue('0.0000001', { slope: '1', offset: '0' })).toBe('0.0000001');
  });

  it('never reports a negative value or bound, whatever the correction and the burns (property)', () => {
    const cell = fc.oneof(
      decimalString({ maxDigits: 10n ** 6n, maxScale: 5 }).map((v) => ({ v, q: null })),
      decimalString({ maxDigits: 10n ** 4n, maxScale: 5 }).map((v) => ({ v, q: '<' as const })),
      decimalString({ maxDigits: 10n ** 4n, maxScale: 4 }).map((v) => ({ v, q: '>' as const })),
    );
    const settings = fc.record({
      detection_limit: fc.constantFrom(null, '0.001', '0.0005'),
      working_range_low: fc.constantFrom(null, '0.002'),
      decimals: fc.integer({ min: 0, max: 5 }),
    });
    const rule = fc.constantFrom('withhold' as const, 'treat_as_bound' as const);
    fc.assert(
      fc.property(
        fc.array(cell, { minLength: 1, maxLength: 6 }),
        decimalString({ maxDigits: 3n * 10n ** 5n, maxScale: 5 }), // slope 0 … 3
        decimalString({ maxDigits: 10n ** 4n, maxScale: 4, signs: ['', '-'] }), // offset −1 … 1
        settings,
        rule,
        (cells, slope, offset, element, mixed) => {
          const method = {
            ...METHOD,
            reporting: { ...METHOD.reporting, mixed_qualified_burns: mixed },
            elements: [{ ...METHOD.elements[0], ...element }],
          };
          const { results } = computeSampleResults(
            cells.map((c) => ({ excluded: false, values: { Mn: c }, corrected: { Mn: correctCell(c, { slope, offset }) } })),
            method,
          );
          const reported = results[0].reported;
          if (reported !== null) expect(new Decimal(reported).isNegative() && !new Decimal(reported).isZero()).toBe(false);
          // A bound and a mean never contradict: a bounded result from mixed burns carries no mean.
          if (results[0].qualifier !== null && results[0].n > 0 && results[0].n_qualified > 0) expect(results[0].mean).toBeNull();
        },
      ),
      { numRuns: 2000 },
    );
  });
});
