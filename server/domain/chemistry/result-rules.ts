// The rules that turn an element's burns into a result, and the flags a result can carry, written
// for people: the API documentation shows RESULT_RULES and RESULT_FLAGS as they are. Each rule says
// whether a standard requires it or whether it is common practice without a source.
// The code that applies them is element-result.ts.

/** Stable flag names (snake_case; part of the API contract) with a one-line description. */
export const RESULT_FLAGS = {
  not_measured: 'No included burn measured this element: there is no result.',
  single_burn: 'The result rests on one numeric burn: no SD, RSD or repeatability check.',
  repeatability_exceeded: 'The range of the burns exceeds the ISO 5725-6 critical range f(n)·σr (95 %).',
  repeatability_unchecked: 'More than 20 numeric burns: beyond the critical-range table, repeatability was not checked.',
  below_detection_limit: "The mean (or its upper bound) is below the method's detection limit.",
  below_working_range: "The mean (or its upper bound) is below the lower end of the method's working range.",
  above_working_range: "The mean (or its lower bound) is above the upper end of the method's working range.",
  burns_outside_working_range: 'At least one burn lies outside the working range although the result does not.',
  all_burns_qualified: 'Every burn was reported as "<", ">" or n.d.: the result is a bound, there is no mean.',
  mixed_qualified_burns:
    'Numeric burns and "<", ">" or n.d. burns together: the result is a bound; mean, SD and n describe the numeric burns only.',
  not_detected: 'At least one burn was reported as not detected (counted as "<" the detection limit).',
  conflicting_qualified_burns: 'Burns say both "<" and ">": no bound holds, nothing is reported.',
  limit_missing:
    'A burn is qualified without a value (n.d., or "<"/">" alone) and the method sets no limit to bound it: nothing is reported.',
  negative_after_correction:
    'At least one burn is below 0 after drift correction. Corrected values are not clamped to 0 (that would bias the mean and break its linearity); a mean below the detection limit is reported as "<" the limit as usual.',
  not_in_method: 'The method does not list this element; it is averaged anyway, with 4 reporting decimals and no limits.',
} as const;

export type ResultFlag = keyof typeof RESULT_FLAGS;
export const RESULT_FLAG_NAMES = Object.keys(RESULT_FLAGS) as ResultFlag[];

export interface ResultRule {
  rule: string;
  basis: string;
}

export const RESULT_RULE_LIST: readonly ResultRule[] = [
  {
    rule: 'The mean, SD (n − 1), RSD % = 100·SD/|mean|, n, min and max are computed over the included burns that carry a numeric value. SD and RSD are null for one burn, RSD also when the mean is 0.',
    basis:
      'Averaging two or three burns: common practice, no source. SD and coefficient of variation as defined in ISO 3534-1 (from memory).',
  },
  {
    rule: 'reported = the mean rounded half to even, in one step from the full-precision mean, to the method\'s decimals for the element, written with trailing zeros ("0.70").',
    basis: 'ASTM E29 (rounding method); ISO 80000-1 Annex B, rule A.',
  },
  {
    rule: 'An element that no included burn measured has no result: all values null, flag not_measured.',
    basis: 'Common practice, no source.',
  },
  {
    rule: 'A mean below the detection limit or below the lower end of the working range is reported as "<" the lowest reportable value, i.e. the larger of those two limits that the method sets. A mean above the upper end of the working range is reported as ">" that end. Limits are compared with the full-precision mean; a mean equal to a limit is inside.',
    basis:
      'Qualifiers "<"/">" for results outside what the method can quantify: product requirement; reporting "< limit" is common practice, no source.',
  },
  {
    rule: 'Burns reported as "<" (n.d. counts as "<" the detection limit): the result is "<" an upper bound — the mean of all burns with each "<" burn set to its limit — but never less than the lowest reportable value. Every burn "<" gives a "<" result (flag all_burns_qualified); "<" and numeric burns together also give a "<" result (flag mixed_qualified_burns).',
    basis:
      'Upper-bound substitution for left-censored data (WHO GEMS/Food 1995; EFSA 2010 — from memory); applying it to burns is our choice, no source.',
  },
  {
    rule: 'Burns reported as ">": the result is ">" a lower bound — the mean with each ">" burn set to its limit — capped at the upper end of the working range. Every burn ">" gives a ">" result.',
    basis: 'The same substitution mirrored for right-censored values: common practice, no source.',
  },
  {
    rule: 'Burns saying both "<" and ">", or a qualified burn with no value and no method limit to stand for it: nothing is reported (reported and qualifier null) and a flag says why.',
    basis: 'No bound is true in these cases: common practice, no source.',
  },
  {
    rule: 'A "<" bound is written with the method\'s decimals rounded up, a ">" bound rounded down, so that the statement stays true ("<0.00045" at 3 decimals → "<0.001").',
    basis: 'Common practice, no source.',
  },
  {
    rule: 'Individual burns outside the working range while the result is inside are flagged (burns_outside_working_range), not changed.',
    basis: 'Common practice, no source.',
  },
  {
    rule: 'With at least two numeric burns and a repeatability SD σr set for the element, the range of the burns is compared with the critical range f(n)·σr (f(2) = 2.77, f(3) = 3.31 …, up to n = 20); a larger range sets repeatability_exceeded. The result is still the mean: the analyst excludes a burn or sparks again.',
    basis:
      'ISO 5725-6:1994 §5.2 and Table 1 (critical range factors). The standard itself would take further results and report the median; flagging instead is our choice.',
  },
];

/** The rules as one text for the API documentation. */
export const RESULT_RULES: string = RESULT_RULE_LIST.map((item, index) => `${index + 1}. ${item.rule} (Basis: ${item.basis})`).join('\n');
