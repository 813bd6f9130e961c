// The result flags as the console shows them. RESULT_FLAG_DESCRIPTIONS is a copy of the server's
// RESULT_FLAGS (server/domain/chemistry/result-rules.ts): the console bundle must not pull in
// server modules, and tests/src/features/samples/result-flags.test.ts fails when the copies differ.
// The short labels and the tone are the console's own.

export const RESULT_FLAG_DESCRIPTIONS = {
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

export type ResultFlag = keyof typeof RESULT_FLAG_DESCRIPTIONS;
export const RESULT_FLAG_NAMES = Object.keys(RESULT_FLAG_DESCRIPTIONS) as ResultFlag[];

/** `attention`: someone should look before the result is used; `note`: context for reading it. */
export type FlagTone = 'attention' | 'note';

const LABELS: Record<ResultFlag, [label: string, tone: FlagTone]> = {
  not_measured: ['Not measured', 'note'],
  single_burn: ['Single burn', 'note'],
  repeatability_exceeded: ['Repeatability exceeded', 'attention'],
  repeatability_unchecked: ['Repeatability not checked', 'note'],
  below_detection_limit: ['Below detection limit', 'note'],
  below_working_range: ['Below working range', 'attention'],
  above_working_range: ['Above working range', 'attention'],
  burns_outside_working_range: ['Burn outside working range', 'attention'],
  all_burns_qualified: ['All burns qualified', 'note'],
  mixed_qualified_burns: ['Mixed qualified burns', 'note'],
  not_detected: ['Not detected', 'note'],
  negative_after_correction: ['Below 0 after drift correction', 'attention'],
  conflicting_qualified_burns: ['Conflicting qualified burns', 'attention'],
  limit_missing: ['Limit missing', 'attention'],
  not_in_method: ['Not in method', 'attention'],
};

export interface FlagInfo {
  name: string;
  label: string;
  tone: FlagTone;
  /** Null for a flag this console version does not know (a newer server may add flags). */
  description: string | null;
}

const isKnown = (name: string): name is ResultFlag => Object.hasOwn(RESULT_FLAG_DESCRIPTIONS, name);

export function flagInfo(name: string): FlagInfo {
  if (!isKnown(name)) return { name, label: name.replaceAll('_', ' '), tone: 'attention', description: null };
  const [label, tone] = LABELS[name];
  return { name, label, tone, description: RESULT_FLAG_DESCRIPTIONS[name] };
}
