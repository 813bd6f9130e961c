/*
 * One element's result from the cells of a sample's INCLUDED burns (values in %, decimal strings).
 *
 * Rules (RESULT_RULES in result-rules.ts says the same for the API documentation):
 * 1. mean, sd (n − 1), rsd = 100·sd/|mean|, n, min, max over the burns with a numeric value;
 *    sd and rsd null when n = 1 (rsd also when the mean is 0).         — averaging: common practice, no source
 * 2. reported = mean rounded half-even, in one step, to the method's decimals. — ASTM E29; ISO 80000-1 B rule A
 * 3. No included burn measured the element (every cell undefined or blank) → no result, flag
 *    not_measured.                                                        — common practice, no source
 * 4. All numeric: mean < detection limit or < working-range low → "<" the lowest reportable value
 *    (the larger of the limits set); mean > working-range high → ">" that end; limits compared with
 *    the full-precision mean, equal is inside. A mean below 0 (possible after an additive drift
 *    correction) is reported the same way, "<" one reporting step when the method sets no limit,
 *    flag below_zero; `mean` keeps the computed value.  — product requirement; common practice, no source
 * 5. "<" burns (n.d. = "<" the detection limit; "<" without a value likewise), all of them "<":
 *    "<" the upper bound U = mean of the burns at their limits, raised to the lowest reportable value
 *    (one reporting step when the method sets none), so a bound is never below 0 (all_burns_qualified).
 *    Numeric and qualified burns together (mixed_qualified_burns) — usually a failed spark — are
 *    withheld by default: nothing reported, spark again. Under the method's `treat_as_bound` rule
 *    they give "<" U (or ">" G) with `mean` null, so mean and bound never contradict each other.
 *                         — upper-bound substitution (WHO GEMS/Food; EFSA 2010, from memory)
 * 6. ">" burns: ">" the lower bound G (each ">" burn at its limit), capped at working-range high.
 *                                                                         — mirror of 5, common practice, no source
 * 7. "<" and ">" burns together → nothing reported (conflicting_qualified_burns); a qualified burn
 *    without a value and no method limit to stand for it → nothing reported (limit_missing).
 *                                                                         — common practice, no source
 * 8. Bounds are written with the method's decimals rounded outward (up for "<", down for ">"), so
 *    that "<"/">" stays true.                                             — common practice, no source
 * 9. Single burns outside the working range while the result is inside → flag only.
 *                                                                         — common practice, no source
 * 10. ≥ 2 burns (at least one numeric) and σr set → ISO 5725-6 §5.2 critical range f(n)·σr; a larger
 *    range flags repeatability_exceeded. A "<" burn counts at its bound from below, a ">" burn from
 *    above, so the range used is the least the burns can span (the standard would take more burns and report the median; we flag and
 *    leave the decision to the analyst); more than 20 burns → repeatability_unchecked.
 */
import { isAbove, isBelow } from './decimal-compare.ts';
import { exactMean } from './exact-mean.ts';
import { MAX_BURNS_FOR_CHECK, MIN_BURNS_FOR_CHECK, rangeCheck, type RepeatabilityCheck } from './repeatability.ts';
import { RESULT_FLAG_NAMES, type ResultFlag } from './result-rules.ts';
import { roundDown, roundHalfEven, roundUp } from './rounding.ts';
import { summarise } from './statistics.ts';

export { RESULT_FLAGS, RESULT_FLAG_NAMES, RESULT_RULES, RESULT_RULE_LIST, type ResultFlag } from './result-rules.ts';

export interface BurnCell {
  value: string | null;
  qualifier: '<' | '>' | 'nd' | null;
}

export interface ElementSettings {
  /** Reporting decimals in % for this element. */
  decimals: number;
  detection_limit?: string | null;
  working_range_low?: string | null;
  working_range_high?: string | null;
  /** Repeatability standard deviation σr in %. */
  repeatability_sd?: string | null;
  /** What numeric and qualified burns together give (default withhold: nothing reported). */
  mixed_qualified_burns?: MixedBurnsRule;
}

export const MIXED_BURNS_RULES = ['withhold', 'treat_as_bound'] as const;
export type MixedBurnsRule = (typeof MIXED_BURNS_RULES)[number];

export interface ElementResultInput {
  element: string;
  /**
   * One cell per INCLUDED burn; undefined (or value and qualifier both null) = not measured.
   * Values are decimal strings in %, as readMassFraction (mass-fraction.ts) stores them; anything else throws.
   */
  cells: ReadonlyArray<BurnCell | undefined>;
  settings: ElementSettings;
}

export interface ElementResult {
  element: string;
  /** Full-precision mean of the numeric burns, in %. */
  mean: string | null;
  sd: number | null;
  rsd: number | null;
  /** Numeric burns behind mean, sd, min and max. */
  n: number;
  min: string | null;
  max: string | null;
  /** Rounded result, or the bound when qualifier is set; null when nothing can be reported. */
  reported: string | null;
  qualifier: '<' | '>' | null;
  flags: ResultFlag[];
  /** Burns reported as "<", ">" or n.d. (added to the agreed interface). */
  n_qualified: number;
  /** The ISO 5725-6 check when it applied, else null (added to the agreed interface). */
  repeatability: RepeatabilityCheck | null;
}

export function computeElementResult(input: ElementResultInput): ElementResult {
  const { element, settings } = input;
  const limits = readLimits(settings);
  const numeric: string[] = [];
  const below: string[] = []; // limits standing for "<" and n.d. burns
  const above: string[] = []; // limits standing for ">" burns
  const flags = new Set<ResultFlag>();
  let qualified = 0;
  let sawBelow = false;
  let sawAbove = false;
  for (const cell of input.cells) {
    if (cell === undefined || (cell.value === null && cell.qualifier === null)) continue;
    if (cell.qualifier === null) {
      numeric.push(cell.value as string);
      continue;
    }
    qualified += 1;
    if (cell.qualifier === 'nd') flags.add('not_detected');
    // The limit that stands for the burn: its own value, else the method's limit on that side.
    const upper = cell.qualifier === '>';
    const stand = (cell.qualifier === 'nd' ? null : cell.value) ?? (upper ? settings.working_range_high : settings.detection_limit);
    if (upper) sawAbove = true;
    else sawBelow = true;
    if (stand === null || stand === undefined || stand === '') flags.add('limit_missing');
    else (upper ? above : below).push(stand);
  }

  const summary = summarise(numeric);
  const result: ElementResult = {
    element,
    ...summary,
    reported: null,
    qualifier: null,
    flags: [],
    n_qualified: qualified,
    repeatability: null,
  };
  if (summary.n + qualified === 0) return finish(result, new Set(['not_measured']));
  if (summary.n === 1) flags.add('single_burn');
  if (qualified > 0) flags.add(summary.n === 0 ? 'all_burns_qualified' : 'mixed_qualified_burns');
  checkRepeatability(result, flags, settings, { numeric: summary, below, above, cells: summary.n + below.length + above.length });

  const mixed = summary.n > 0 && qualified > 0;
  if (sawBelow && sawAbove) {
    flags.add('conflicting_qualified_burns');
  } else if (flags.has('limit_missing')) {
    // nothing can be reported: a burn stands for an unknown value
  } else if (mixed && (settings.mixed_qualified_burns ?? 'withhold') === 'withhold') {
    // withheld: numeric and qualified burns disagree about what the instrument saw; spark again
  } else if (below.length > 0) {
    reportBelow(result, flags, limits, exactMean([...numeric, ...below]), settings.decimals);
  } else if (above.length > 0) {
    reportAbove(result, flags, limits, exactMean([...numeric, ...above]), settings.decimals);
  } else {
    reportNumeric(result, flags, limits, numeric, settings.decimals);
  }
  // A bound from numeric and qualified burns together is not the numeric burns' mean: say none.
  if (mixed && result.qualifier !== null) Object.assign(result, { mean: null, sd: null, rsd: null });
  return finish(result, flags);
}

interface Spread {
  numeric: { n: number; min: string | null; max: string | null };
  below: readonly string[];
  above: readonly string[];
  cells: number;
}

/** The ISO 5725-6 range check over the least range the burns can span: "<" at its bound, ">" at its. */
function checkRepeatability(result: ElementResult, flags: Set<ResultFlag>, settings: ElementSettings, spread: Spread): void {
  if (!settings.repeatability_sd || spread.numeric.n === 0 || spread.cells < MIN_BURNS_FOR_CHECK) return;
  let low = spread.numeric.min as string;
  let high = spread.numeric.max as string;
  for (const bound of spread.below) if (isBelow(bound, low)) low = bound;
  for (const bound of spread.above) if (isAbove(bound, high)) high = bound;
  result.repeatability = rangeCheck(low, high, spread.cells, settings.repeatability_sd);
  if (result.repeatability?.exceeded) flags.add('repeatability_exceeded');
  if (spread.cells > MAX_BURNS_FOR_CHECK) flags.add('repeatability_unchecked');
}

/** A limit as written and as a double (the double only speeds up comparisons, see decimal-compare.ts). */
interface Limit {
  text: string;
  number: number;
}

interface Limits {
  detection?: Limit;
  low?: Limit;
  high?: Limit;
  /** The larger of detection limit and working-range low: nothing below it is quantified. */
  lowestReportable?: Limit;
}

function read(text: string | null | undefined): Limit | undefined {
  return text === null || text === undefined || text === '' ? undefined : { text, number: Number(text) };
}

function readLimits(settings: ElementSettings): Limits {
  const detection = read(settings.detection_limit);
  const low = read(settings.working_range_low);
  const high = read(settings.working_range_high);
  const lowestReportable = detection && low ? (below(detection, low) ? low : detection) : (detection ?? low);
  return { detection, low, high, lowestReportable };
}

function below(value: Limit, limit: Limit | undefined): boolean {
  return limit !== undefined && isBelow(value.text, limit.text, value.number, limit.number);
}

function above(value: Limit, limit: Limit | undefined): boolean {
  return limit !== undefined && isAbove(value.text, limit.text, value.number, limit.number);
}

/** Flags a value (mean or bound) below the lower limits; true when it is below either. */
function flagLow(value: Limit, limits: Limits, flags: Set<ResultFlag>): boolean {
  const belowDetection = below(value, limits.detection);
  const belowRange = below(value, limits.low);
  if (belowDetection) flags.add('below_detection_limit');
  if (belowRange) flags.add('below_working_range');
  return belowDetection || belowRange;
}

/** One step of the last reporting decimal ("0.001" for 3 decimals): the floor of any "<" bound. */
function reportingStep(decimals: number): Limit {
  const text = decimals === 0 ? '1' : `0.${'0'.repeat(decimals - 1)}1`;
  return { text, number: Number(text) };
}

function reportBelow(result: ElementResult, flags: Set<ResultFlag>, limits: Limits, upperBound: string, decimals: number): void {
  const bound = { text: upperBound, number: Number(upperBound) };
  flagLow(bound, limits, flags);
  const floor = limits.lowestReportable ?? reportingStep(decimals);
  result.reported = roundUp((below(bound, floor) ? floor : bound).text, decimals);
  result.qualifier = '<';
}

function reportAbove(result: ElementResult, flags: Set<ResultFlag>, limits: Limits, lowerBound: string, decimals: number): void {
  const capped = above({ text: lowerBound, number: Number(lowerBound) }, limits.high);
  if (capped) flags.add('above_working_range');
  // A lower bound below 0 (after a drift correction) says no more than ">0".
  result.reported = roundDown(capped ? (limits.high as Limit).text : isBelow(lowerBound, '0') ? '0' : lowerBound, decimals);
  result.qualifier = '>';
}

function reportNumeric(result: ElementResult, flags: Set<ResultFlag>, limits: Limits, numeric: readonly string[], decimals: number): void {
  const mean = { text: result.mean as string, number: Number(result.mean) };
  const belowZero = isBelow(mean.text, '0', mean.number, 0);
  if (belowZero) flags.add('below_zero');
  if (flagLow(mean, limits, flags) || belowZero) {
    result.reported = roundUp((limits.lowestReportable ?? reportingStep(decimals)).text, decimals);
    result.qualifier = '<';
  } else if (above(mean, limits.high)) {
    flags.add('above_working_range');
    result.reported = roundDown((limits.high as Limit).text, decimals);
    result.qualifier = '>';
  } else {
    result.reported = roundHalfEven(mean.text, decimals);
    if (limits.low || limits.high) {
      for (const text of numeric) {
        const value = { text, number: Number(text) };
        if (below(value, limits.low) || above(value, limits.high)) flags.add('burns_outside_working_range');
      }
    }
  }
}

/** Flags in the documented order, so that equal results serialise identically. */
function finish(result: ElementResult, flags: ReadonlySet<ResultFlag>): ElementResult {
  for (const flag of RESULT_FLAG_NAMES) if (flags.has(flag)) result.flags.push(flag);
  return result;
}
