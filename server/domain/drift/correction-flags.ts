/*
 * Flags on one element of a standardization: ok | warn | fail, with reasons a reader understands
 * without the code. Rules (each also stated in the API description, STANDARDIZATION_RULES):
 * 1. |α − 1| above the method's warn limit → warn; above its fail limit → fail (defaults 0.2 and
 *    0.5; a limit equal to the distance passes).                        — common practice, no source
 *    one_point_offset has α = 1: its offset is judged instead, as |β| / nominal against the same limits.
 * 2. α < 0 → fail: the references' order is reversed.                   — arithmetic, no source needed
 * 3. two_point with measured levels too close: |H − L| < 10 % of the higher measured level → warn,
 *    because burn noise then moves the slope a lot.                     — common practice, no source
 * 4. An element with no nominal value or no numeric measurement in a reference → warn, and the
 *    element is not corrected by this set.                              — our choice
 * 5. A reference's burns that disagree (range above the ISO 5725-6 critical range f(n)·σr with the
 *    method's σr) → warn.                                               — ISO 5725-6:1994 §5.2
 * 6. The slope moved from the set in force at the measurement time by more than the method's
 *    slope_change_warn / slope_change_fail (defaults 5 % / 15 %).      — common practice, no source
 */
import { Decimal } from 'decimal.js';
import { isAbove } from '../chemistry/decimal-compare.ts';
import type { RepeatabilityCheck } from '../chemistry/repeatability.ts';
import { roundHalfEven } from '../chemistry/rounding.ts';
import type { DriftLimits } from '../methods/methods.schemas.ts';
import type { Correction, CorrectionMode, Level } from './correction-math.ts';

export const CORRECTION_FLAGS = ['ok', 'warn', 'fail'] as const;
export type CorrectionFlag = (typeof CORRECTION_FLAGS)[number];

/** Measured levels closer than this fraction of the higher one make a two-point slope unreliable. */
const MIN_RELATIVE_SPAN = '0.1';

const Exact = Decimal.clone({ precision: 200 });

export function worstFlag(flags: readonly CorrectionFlag[]): CorrectionFlag {
  return flags.includes('fail') ? 'fail' : flags.includes('warn') ? 'warn' : 'ok';
}

/** A short human form of a long decimal for the reasons (4 decimals, half-even). */
export function short(value: string): string {
  return roundHalfEven(value, 4)
    .replace(/(\.\d*?)0+$/, '$1')
    .replace(/\.$/, '');
}

export interface FlagResult {
  flag: CorrectionFlag;
  reason: string;
}

/** Rules 1 and 2 for the correction of one element. */
export function limitFlags(
  mode: CorrectionMode,
  correction: Correction,
  limits: DriftLimits,
  methodCode: string,
  reference?: Level,
): FlagResult[] {
  const found: FlagResult[] = [];
  const slope = new Exact(correction.slope);
  if (slope.isNegative()) {
    found.push({
      flag: 'fail',
      reason: `Slope ${short(correction.slope)} is negative: the reference meant to be high measured below the low one. Check that the references were not swapped.`,
    });
  }
  let distance: string;
  let what: string;
  if (mode === 'one_point_offset' && reference) {
    const nominal = new Exact(reference.nominal).abs();
    if (nominal.isZero()) return found;
    distance = new Exact(correction.offset).abs().div(nominal).toFixed();
    what = `Offset ${short(correction.offset)} % moves the reference by ${short(new Exact(distance).times(100).toFixed())} % of its nominal value ${reference.nominal} %`;
  } else {
    distance = slope.minus(1).abs().toFixed();
    what = `Slope ${short(correction.slope)} is ${short(distance)} away from 1`;
  }
  if (isAbove(distance, limits.fail)) {
    found.push({
      flag: 'fail',
      reason: `${what}: more than the fail limit ${limits.fail} of method ${methodCode}. Activating it needs an override reason.`,
    });
  } else if (isAbove(distance, limits.warn)) {
    found.push({
      flag: 'warn',
      reason: `${what}: more than the warn limit ${limits.warn} of method ${methodCode} (fail above ${limits.fail}).`,
    });
  }
  return found;
}

/** Rule 3: the measured levels of a two-point standardization are too close together. */
export function spanFlag(high: Level, low: Level, highCode: string, lowCode: string): FlagResult | null {
  const span = new Exact(high.measured).minus(low.measured).abs();
  const top = Decimal.max(new Exact(high.measured).abs(), new Exact(low.measured).abs());
  const limit = top.times(MIN_RELATIVE_SPAN);
  if (!span.lt(limit)) return null;
  return {
    flag: 'warn',
    reason: `The measured levels are close: ${highCode} ${short(high.measured)} % and ${lowCode} ${short(low.measured)} % differ by ${short(span.toFixed())} %, less than 10 % of the higher level, so burn-to-burn noise moves the slope a lot. Use references further apart.`,
  };
}

/** Rule 5: the burns of one reference disagree. */
export function agreementFlag(check: RepeatabilityCheck | null, n: number, sigmaR: string, code: string): FlagResult | null {
  if (!check?.exceeded) return null;
  return {
    flag: 'warn',
    reason: `The ${n} burns of ${code} disagree: their range ${short(check.range)} % exceeds the ISO 5725-6 critical range f(${n})·σr = ${short(check.critical_range)} % (σr ${sigmaR} %). Spark it again before relying on this correction.`,
  };
}

/**
 * Rule 6: the slope moved too far from the set in force at the run's measurement time:
 * |α / α_previous − 1| above the method's slope_change_warn / slope_change_fail.
 *                                                                       — common practice, no source
 */
export function changeFlag(slope: string, previousSlope: string | null, limits: DriftLimits, methodCode: string): FlagResult | null {
  if (previousSlope === null || new Exact(previousSlope).isZero()) return null;
  const change = new Exact(slope).div(previousSlope).minus(1);
  const distance = change.abs().toFixed();
  const percent = (value: string) => `${roundHalfEven(new Exact(value).times(100).toFixed(), 1).replace(/\.0$/, '')} %`;
  const what = `Slope ${short(slope)} moved ${change.isNegative() ? '−' : '+'}${percent(distance)} from ${short(previousSlope)} of the set before`;
  if (limits.slope_change_fail !== null && isAbove(distance, limits.slope_change_fail)) {
    return {
      flag: 'fail',
      reason: `${what}: more than the ${percent(limits.slope_change_fail)} method ${methodCode} allows between runs. Check the references and the instrument before activating; activating it needs an override reason.`,
    };
  }
  if (limits.slope_change_warn !== null && isAbove(distance, limits.slope_change_warn)) {
    return {
      flag: 'warn',
      reason: `${what}: more than the ${percent(limits.slope_change_warn)} method ${methodCode} expects between runs${limits.slope_change_fail ? ` (fail above ${percent(limits.slope_change_fail)})` : ''}.`,
    };
  }
  return null;
}
