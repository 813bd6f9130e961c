// Descriptive statistics of one element's burns: mean, sample SD (n − 1), RSD %, min, max.
//
// Number types, chosen on purpose:
// - The MEAN is an exact decimal string, correctly rounded to 34 significant digits (see
//   exact-mean.ts). It is the value that gets rounded half-even and compared with grade limits:
//   the mean of "12.3" and "12.4" must be exactly "12.35" so that the tie goes to "12.4".
// - MIN and MAX are the input strings themselves (no conversion at all).
// - SD and RSD are JavaScript numbers: they are descriptive (shown, charted, compared with σr
//   with a margin), never rounded for conformance, and a double's 15–16 digits are far more than
//   their own uncertainty. They use the two-pass algorithm with the correction term
//   (Chan, Golub & LeVeque 1983): deviations from the mean, so the cancellation that ruins the
//   textbook Σx² − n·x̄² formula (all digits lost on NIST StRD NumAcc3/NumAcc4) does not occur.
//   Plain decimal inputs are first turned into exact integers at a common scale (exact-mean.ts),
//   so the deviations carry no binary representation error either; other inputs fall back to
//   doubles, where about 1e-8 relative error remains on NumAcc4.
import { Decimal } from 'decimal.js';
import { decimalMean, meanOfScaled, toScaledIntegers } from './exact-mean.ts';

export { exactMean } from './exact-mean.ts';

export interface Summary {
  /** Number of values. */
  n: number;
  /** Exact mean as a plain decimal string (34 significant digits at most); null when n = 0. */
  mean: string | null;
  /** Sample standard deviation (n − 1); null when n < 2. */
  sd: number | null;
  /** Relative standard deviation in %, 100·SD/|mean|; null when n < 2 or the mean is 0. */
  rsd: number | null;
  /** Smallest and largest value, as given; null when n = 0. */
  min: string | null;
  max: string | null;
}

/**
 * Sample standard deviation (n − 1) around `mean`, two-pass with the correction term
 * Σd²  − (Σd)²/n, which also absorbs the rounding of `mean` to a double. Null when n < 2.
 */
export function sampleStandardDeviation(values: readonly number[], mean: number): number | null {
  const n = values.length;
  if (n < 2) return null;
  let sumDeviation = 0;
  let sumSquares = 0;
  for (const value of values) {
    const deviation = value - mean;
    sumDeviation += deviation;
    sumSquares += deviation * deviation;
  }
  const variance = (sumSquares - (sumDeviation * sumDeviation) / n) / (n - 1);
  return Math.sqrt(Math.max(0, variance));
}

/** Relative standard deviation in % (coefficient of variation × 100); null when the mean is 0. */
function relativeStandardDeviation(sd: number | null, mean: number): number | null {
  if (sd === null) return null;
  const magnitude = Math.abs(mean);
  return magnitude === 0 ? null : (100 * sd) / magnitude;
}

/** Mean, SD, RSD, min and max of decimal strings in one call (the per-element hot path). */
export function summarise(values: readonly string[]): Summary {
  const n = values.length;
  if (n === 0) return { n: 0, mean: null, sd: null, rsd: null, min: null, max: null };
  // Plain decimals become exact integers at a common scale: comparisons and deviations between
  // them are then exact, and the SD is correct to the last few bits even on NumAcc4.
  const scaled = toScaledIntegers(values);
  const numbers = scaled ? scaled.integers : values.map(Number);
  const mean = scaled ? meanOfScaled(scaled) : decimalMean(values);
  let sd = sampleStandardDeviation(numbers, scaled ? scaled.sum / n : Number(mean));
  if (sd !== null && scaled) sd /= 10 ** scaled.scale;
  let minIndex = 0;
  let maxIndex = 0;
  for (let i = 1; i < n; i++) {
    if (lessThan(values, numbers, i, minIndex)) minIndex = i;
    if (lessThan(values, numbers, maxIndex, i)) maxIndex = i;
  }
  // The mean as a double for the RSD only (descriptive); parsing the 34-digit string is slower.
  const meanNumber = scaled ? scaled.sum / n / 10 ** scaled.scale : Number(mean);
  return { n, mean, sd, rsd: relativeStandardDeviation(sd, meanNumber), min: values[minIndex], max: values[maxIndex] };
}

/** values[a] < values[b]. Doubles decide unless they tie (only possible when not scaled exactly). */
function lessThan(values: readonly string[], numbers: readonly number[], a: number, b: number): boolean {
  if (numbers[a] !== numbers[b]) return numbers[a] < numbers[b];
  return values[a] !== values[b] && new Decimal(values[a]).lt(values[b]);
}
