import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { mean as ssMean, sampleStandardDeviation as ssSampleSd } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { exactMean, sampleStandardDeviation, summarise } from '../../../server/domain/chemistry/statistics.ts';
import { STRD_DATASETS } from '../../fixtures/nist-strd-univariate.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

const relativeError = (actual: number, expected: string) => Math.abs(actual - Number(expected)) / Math.abs(Number(expected));

/** The textbook one-pass formula √((Σx² − (Σx)²/n)/(n − 1)): what the tolerances must rule out. */
function naiveSd(values: number[]): number {
  const n = values.length;
  const sum = values.reduce((total, value) => total + value, 0);
  const squares = values.reduce((total, value) => total + value * value, 0);
  return Math.sqrt((squares - (sum * sum) / n) / (n - 1));
}

describe('summarise against NIST StRD univariate certified values', () => {
  // Certified values: NIST StRD (https://www.itl.nist.gov/div898/strd/univ/), copied in
  // docs/references.md#statistics; data: tests/fixtures/nist-strd-univariate.ts (sources named there).
  // The mean is exact (decimal), so it must equal the certified value digit for digit. The SD is a
  // double: NIST calls 15 correct digits certified; we ask for 1e-13 relative.
  it.each(STRD_DATASETS.map((dataset) => [dataset.name, dataset] as const))('%s', (_name, dataset) => {
    const summary = summarise(dataset.values);
    expect(summary.n).toBe(dataset.values.length);
    expect(new Decimal(summary.mean as string).eq(dataset.certifiedMean)).toBe(true);
    expect(relativeError(summary.sd as number, dataset.certifiedSd)).toBeLessThan(1e-13);
  });

  it('needs a stable algorithm: the naive formula fails NumAcc3 and NumAcc4 at this tolerance', () => {
    for (const name of ['NumAcc3', 'NumAcc4']) {
      const dataset = STRD_DATASETS.find((candidate) => candidate.name === name)!;
      const naive = naiveSd(dataset.values.map(Number));
      expect(Number.isNaN(naive) || relativeError(naive, dataset.certifiedSd) > 1e-3).toBe(true);
    }
  });

  it('stays accurate on doubles too (the path for values that are not plain decimals)', () => {
    // NumAcc4 through sampleStandardDeviation on doubles: docs/references.md#statistics says doubles reach about
    // 1e-7 relative on NumAcc4 and 1e-9 on NumAcc3 with a two-pass algorithm.
    const acc3 = STRD_DATASETS.find((dataset) => dataset.name === 'NumAcc3')!;
    const acc4 = STRD_DATASETS.find((dataset) => dataset.name === 'NumAcc4')!;
    expect(relativeError(sampleStandardDeviation(acc3.values.map(Number), 1000000.2) as number, '0.1')).toBeLessThan(1e-9);
    expect(relativeError(sampleStandardDeviation(acc4.values.map(Number), 10000000.2) as number, '0.1')).toBeLessThan(1e-7);
  });
});

describe('exact mean', () => {
  it('gives the exact tie that half-even rounding needs: mean(12.3, 12.4) = 12.35', () => {
    expect(exactMean(['12.3', '12.4'])).toBe('12.35');
    expect((12.3 + 12.4) / 2).not.toBe(12.35); // binary floats: 12.350000000000001
  });

  it('rounds a non-terminating mean half-even to 34 significant digits (decimal128)', () => {
    expect(exactMean(['1', '0', '0'])).toBe('0.3333333333333333333333333333333333');
    expect(exactMean(['2', '0', '0'])).toBe('0.6666666666666666666666666666666667');
    expect(exactMean(['0.0001', '0', '0'])).toBe('0.00003333333333333333333333333333333333');
  });

  it('writes plain notation, never exponents or "-0"', () => {
    expect(exactMean(['0.0000001'])).toBe('0.0000001');
    expect(exactMean(['-1', '1'])).toBe('0');
    expect(exactMean(['1e-7', '3e-7'])).toBe('0.0000002'); // exponent input: decimal.js path
  });

  it('refuses an empty list', () => {
    expect(() => exactMean([])).toThrow(RangeError);
  });
});

describe('summarise edge cases', () => {
  it('has no SD or RSD for one value', () => {
    expect(summarise(['0.75'])).toEqual({ n: 1, mean: '0.75', sd: null, rsd: null, min: '0.75', max: '0.75' });
  });

  it('has nothing for no values', () => {
    expect(summarise([])).toEqual({ n: 0, mean: null, sd: null, rsd: null, min: null, max: null });
  });

  it('has no RSD when the mean is 0', () => {
    const summary = summarise(['-0.1', '0.1']);
    expect(summary.mean).toBe('0');
    expect(summary.sd).toBeCloseTo(Math.SQRT2 * 0.1, 15);
    expect(summary.rsd).toBeNull();
  });

  it('returns min and max as written, ordering exactly even where doubles tie', () => {
    const summary = summarise(['0.750', '0.7500000000000000000001', '0.7499999999999999999999']);
    expect(summary.min).toBe('0.7499999999999999999999');
    expect(summary.max).toBe('0.7500000000000000000001');
    expect(summarise(['0.752', '0.748', '0.750'])).toMatchObject({ min: '0.748', max: '0.752', mean: '0.75' });
  });

  it('computes RSD % as 100·SD/|mean| (worked example, common definition of the coefficient of variation)', () => {
    // 0.752, 0.748, 0.750: mean 0.75, deviations 0.002, −0.002, 0 → SD = √(0.000008/2) = 0.002.
    const summary = summarise(['0.752', '0.748', '0.750']);
    expect(summary.sd).toBeCloseTo(0.002, 15);
    expect(summary.rsd).toBeCloseTo((100 * 0.002) / 0.75, 12);
  });
});

describe('summarise against simple-statistics (property)', () => {
  // simple-statistics 7.12.1: mean and sampleStandardDeviation (n − 1) on doubles.
  const decimal = decimalString({ maxDigits: 10n ** 9n, maxScale: 8, signs: ['', '', '', '-'] });

  it('mean, SD and RSD agree with simple-statistics within double precision', () => {
    fc.assert(
      fc.property(fc.array(decimal, { minLength: 2, maxLength: 40 }), (values) => {
        const numbers = values.map(Number);
        const summary = summarise(values);
        const expectedMean = ssMean(numbers);
        const expectedSd = ssSampleSd(numbers);
        const scale = Math.max(...numbers.map(Math.abs), 1e-300);
        expect(Math.abs(Number(summary.mean) - expectedMean)).toBeLessThanOrEqual(1e-12 * scale);
        expect(Math.abs((summary.sd as number) - expectedSd)).toBeLessThanOrEqual(1e-9 * scale);
        if (expectedMean !== 0 && summary.rsd !== null && Math.abs(expectedMean) > 1e-6 * scale) {
          const expectedRsd = (100 * expectedSd) / Math.abs(expectedMean);
          expect(Math.abs((summary.rsd as number) - expectedRsd)).toBeLessThanOrEqual(1e-6 * expectedRsd + 1e-12);
        }
        // "+ 0" folds −0 into 0: the strings "-0" and "0" are the same value, Math.min keeps the sign.
        expect(Number(summary.min) + 0).toBe(Math.min(...numbers) + 0);
        expect(Number(summary.max) + 0).toBe(Math.max(...numbers) + 0);
      }),
      { numRuns: 1000 },
    );
  });
});
