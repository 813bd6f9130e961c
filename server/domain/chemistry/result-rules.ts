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
  below_zero:
    'The corrected mean is below 0 (possible after an additive drift correction): reported as "<" the lowest reportable value — one reporting step when the method sets no limit. `mean` keeps the computed value for traceability.',
  all_burns_qualified: 'Every burn was reported as "<", ">" or n.d.: the result is a bound, there is no mean.',
  mixed_qualified_burns:
    'Numeric burns and "<", ">" or n.d. burns together — usually a failed spark. Withheld by default (nothing reported: spark again); under the method\'s treat_as_bound rule the result is a bound and `mean` is null, so the two never contradict each other.',
  not_detected: 'At least one burn was reported as not detected (counted as "<" the detection limit).',
  conflicting_qualified_burns: 'Burns say both "<" and ">": no bound holds, nothing is reported.',
  limit_missing:
    'A burn is qualified without a value (n.d., or "<"/">" alone) and the method sets no limit to bound it: nothing is reported.',
  negative_after_correction:
    'At least one burn is below 0 after drift correction. Corrected burn values are kept as computed (clamping them to 0 would bias the mean); no reported value or bound is ever below 0.',
  balance_by_difference:
    'The method\'s matrix element, reported by difference: 100 % minus every other reported element (numeric results at their mean, "<" results as 0, ">" results at their bound). Not measured; nothing is reported when another element has no reported value or the others add up to more than 100 %.',
  sum_above_100:
    "On the sample: its reported elements add up to more than 100 % plus the method's tolerance (default 0.5 %). Check the burns and the method before using the result.",
  not_in_method:
    'The method does not list this element: its burns are kept and averaged for traceability but nothing is reported, unless the method reports unlisted elements (then with 4 decimals and no limits).',
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
    rule: 'reported = the mean rounded half to even, in one step from the full-precision mean, to the method\'s decimals for the element, written with trailing zeros ("0.70"). In ppm and ppb (`?unit=`) it is rounded the same way from the mean in that unit, to whole ppm (ppb) or to the method\'s step where that is finer — decimals max(0, d − 4) in ppm and max(0, d − 7) in ppb — never the % value scaled (a Si mean of 5943 ppm is reported "5943", not "5900"). The step says how the value is written; the method\'s repeatability says how far it can be relied on.',
    basis: 'ASTM E29 (rounding method); ISO 80000-1 Annex B, rule A.',
  },
  {
    rule: 'An element that no included burn measured has no result: all values null, flag not_measured.',
    basis: 'Common practice, no source.',
  },
  {
    rule: 'A mean below the detection limit or below the lower end of the working range is reported as "<" the lowest reportable value, i.e. the larger of those two limits that the method sets. A mean above the upper end of the working range is reported as ">" that end. Limits are compared with the full-precision mean; a mean equal to a limit is inside. A mean below 0 (after an additive drift correction) is reported as "<" the lowest reportable value too — "<" one reporting step when the method sets no limit — with the flag below_zero; `mean` keeps the computed value.',
    basis:
      'Qualifiers "<"/">" for results outside what the method can quantify: product requirement; reporting "< limit" is common practice, no source.',
  },
  {
    rule: 'Burns all reported as "<" (n.d. counts as "<" the detection limit): the result is "<" an upper bound — the mean of the burns at their limits — but never less than the lowest reportable value (one reporting step when the method sets none), so no bound is ever below 0 (flag all_burns_qualified). Numeric and "<", ">" or n.d. burns together (flag mixed_qualified_burns), usually a failed spark, follow the method\'s rule: `withhold` (the default) reports nothing — spark again; `treat_as_bound` reports "<" the same upper bound (">" a lower bound) with `mean`, SD and RSD null, so that mean and bound never contradict each other.',
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
    rule: 'With at least two burns, one of them numeric, and a repeatability SD σr set for the element, the range of the burns — the least range they can span, a "<" burn counted at its bound from below and a ">" burn from above — is compared with the critical range f(n)·σr (f(2) = 2.77, f(3) = 3.31 …, up to n = 20); a larger range sets repeatability_exceeded. The result is still the mean: the analyst excludes a burn or sparks again.',
    basis:
      'ISO 5725-6:1994 §5.2 and Table 1 (critical range factors). The standard itself would take further results and report the median; flagging instead is our choice.',
  },
  {
    rule: 'Elements the method does not list are kept in the burns and averaged for traceability, but nothing is reported (flag not_in_method) unless the method reports unlisted elements (reporting.unlisted_elements = "report"; then with 4 decimals and no limits).',
    basis:
      'A result outside the validated scope of the method is not a reportable result (ISO/IEC 17025 §7.2, from memory); the opt-in is a product choice.',
  },
  {
    rule: 'When the method reports its matrix element by difference (reporting.balance_by_difference), that element is 100 % minus every other reported element: numeric results at their full-precision mean, "<" results as 0, ">" results at their bound; rounded like any result and flagged balance_by_difference. Nothing is reported for it when another element has no reported value or the others exceed 100 %.',
    basis:
      'Reporting the base metal as "balance" or "remainder" is common practice, no source; counting "<" results as 0 is our choice and makes the balance an upper estimate by at most the sum of those bounds.',
  },
  {
    rule: 'A sample whose reported elements (numeric at their mean, ">" at their bound, the balance left out) add up to more than 100 % plus the method\'s tolerance (reporting.sum_tolerance, default 0.5 %) carries the flag sum_above_100.',
    basis: 'Mass fractions cannot add up to more than 100 %; the 0.5 % default tolerance is common practice, no source.',
  },
];

/** The rules as one text for the API documentation. */
export const RESULT_RULES: string = RESULT_RULE_LIST.map((item, index) => `${index + 1}. ${item.rule} (Basis: ${item.basis})`).join('\n');
