// Repeatability check of a sample's burns (ISO 5725-6:1994 §5.2, Table 1): the range of n results
// obtained under repeatability conditions should not exceed the critical range CR(n) = f(n)·σr,
// where f(n) is the 95 % quantile of the studentized range of n normal values with infinite
// degrees of freedom, q(0.95; n, ∞). ISO 5725-6 tabulates f(n) to one decimal (2.8, 3.3, 3.6,
// 3.9, 4.0 …); the table below keeps two, computed with jstat (`jStat.tukey.inv(0.95, n, df)`,
// df → ∞) and checked against it in tests/unit/chemistry/repeatability.test.ts. Hard-coded so
// that no statistics library runs in production; jstat is a devDependency only.
//
// What the standard then does (ISO 5725-6 §5.2.2, from memory): when the range exceeds CR(n),
// take further results and report the median instead of the mean. Meltwire only FLAGS the
// result; excluding a burn or sparking again is the analyst's decision, recorded with a reason.
import { Decimal } from 'decimal.js';
import { isAbove, isBelow } from './decimal-compare.ts';
import { formatScaled, toScaledIntegers } from './exact-mean.ts';

/** Wide enough that differences and products of instrument values are exact. */
const Exact = Decimal.clone({ precision: 60 });

/** f(n) for n = 2 … 20 at 95 % (q(0.95; n, ∞), rounded to two decimals). */
export const CRITICAL_RANGE_FACTORS: Readonly<Record<number, string>> = {
  2: '2.77',
  3: '3.31',
  4: '3.63',
  5: '3.86',
  6: '4.03',
  7: '4.17',
  8: '4.29',
  9: '4.39',
  10: '4.47',
  11: '4.55',
  12: '4.62',
  13: '4.68',
  14: '4.74',
  15: '4.80',
  16: '4.85',
  17: '4.89',
  18: '4.93',
  19: '4.97',
  20: '5.01',
};

export const MIN_BURNS_FOR_CHECK = 2;
export const MAX_BURNS_FOR_CHECK = 20;

export interface RepeatabilityCheck {
  /** max − min of the values, exact decimal string. */
  range: string;
  /** f(n)·σr, exact decimal string. */
  critical_range: string;
  /** range > critical_range (a range equal to it passes). */
  exceeded: boolean;
}

/** f(n) as a decimal string, or undefined outside n = 2 … 20. */
export function criticalRangeFactor(n: number): string | undefined {
  return CRITICAL_RANGE_FACTORS[n];
}

/**
 * Compares the range of `values` (decimal strings, one per burn) with f(n)·σr. Returns null when
 * the check does not apply: fewer than 2 or more than 20 values (no factor), or σr not positive.
 */
export function repeatabilityCheck(values: readonly string[], sigmaR: string): RepeatabilityCheck | null {
  if (values.length === 0) return null;
  let min = values[0];
  let max = values[0];
  for (const value of values) {
    if (isBelow(value, min)) min = value;
    if (isAbove(value, max)) max = value;
  }
  return rangeCheck(min, max, values.length, sigmaR);
}

/** The same check from the smallest and largest of n values (when they are already known). */
export function rangeCheck(min: string, max: string, n: number, sigmaR: string): RepeatabilityCheck | null {
  const critical = criticalRange(n, sigmaR);
  if (critical === null) return null;
  const range = exactDifference(max, min);
  return { range, critical_range: critical, exceeded: isAbove(range, critical) };
}

/** max − min as an exact decimal string; as integers at a common scale when they fit. */
function exactDifference(max: string, min: string): string {
  const scaled = toScaledIntegers([max, min]);
  const difference = scaled && scaled.integers[0] - scaled.integers[1];
  if (scaled && difference !== undefined && Number.isSafeInteger(difference)) {
    return difference === 0 ? '0' : formatScaled(String(Math.abs(difference)), scaled.scale, difference < 0);
  }
  const exact = new Exact(max).minus(min);
  return exact.isZero() ? '0' : exact.toFixed();
}

/** f(n)·σr, remembered: a method has few σr values and every sample repeats them. */
const criticalRanges = new Map<string, string | null>();

function criticalRange(n: number, sigmaR: string): string | null {
  const key = `${n}|${sigmaR}`;
  let critical = criticalRanges.get(key);
  if (critical === undefined) {
    const factor = criticalRangeFactor(n);
    const sigma = new Exact(sigmaR);
    critical = factor === undefined || !sigma.gt(0) ? null : sigma.times(factor).toFixed();
    if (criticalRanges.size >= 10_000) criticalRanges.clear(); // bounds the memory, never changes an answer
    criticalRanges.set(key, critical);
  }
  return critical;
}
