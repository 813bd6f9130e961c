// A composition against one grade version: every limited element, the remainder by difference,
// "others" each and total, and the aims. `conforms` is true only when every check passes with
// nothing undetermined or missing; any failure makes it false; otherwise it is null ("cannot decide").
import { Decimal } from 'decimal.js';
import type { MeasuredValue } from '../chemistry/measured-value.ts';
import { roundHalfEven } from '../chemistry/rounding.ts';
import { type DecisionRule, judge, type Judgement, written } from './limit-judgement.ts';

export interface GradeDefinition {
  matrix: string;
  decision_rule: DecisionRule;
  remainder_element?: string;
  limits: { element: string; min?: string; max?: string }[];
  others_each?: string;
  others_total?: string;
  aims?: { element: string; min?: string; max?: string }[];
}

export type Composition = ReadonlyMap<string, MeasuredValue>;

/** Unlisted elements count towards "others total" from this mass fraction (%), each first rounded to two decimals. */
const OTHERS_THRESHOLD = '0.010';
const OTHERS_DECIMALS = 2;

function remainderOf(composition: Composition, element: string): { value: MeasuredValue; approximate: boolean } {
  let sum = new Decimal(0);
  let approximate = false;
  for (const [symbol, m] of composition) {
    if (symbol === element) continue;
    if (m.kind === 'value') sum = sum.plus(m.value);
    else if (m.kind === 'qualified') {
      sum = sum.plus(m.value);
      approximate = true;
    } else if (m.kind === 'not_detected') approximate = true;
  }
  const value = Decimal.max(0, new Decimal(100).minus(sum)).toFixed();
  return { value: { kind: 'value', value, qualifier: null }, approximate };
}

function othersOf(definition: GradeDefinition, composition: Composition, rule: DecisionRule) {
  const listed = new Set([definition.matrix, definition.remainder_element, ...definition.limits.map((l) => l.element)]);
  const others = [...composition].filter(([symbol]) => !listed.has(symbol));
  const each = definition.others_each
    ? others.map(([element, m]) => ({ element, ...judge(m, { max: definition.others_each }, rule) }))
    : [];
  if (!definition.others_total) return { each, total: undefined };
  let sum = new Decimal(0);
  let bound = false;
  for (const [, m] of others) {
    if (m.kind === 'value' && new Decimal(m.value).gte(OTHERS_THRESHOLD)) sum = sum.plus(roundHalfEven(m.value, OTHERS_DECIMALS));
    if (m.kind === 'qualified' && (m.qualifier === '>' || new Decimal(m.value).gt(OTHERS_THRESHOLD))) bound = true;
  }
  const total: MeasuredValue = bound
    ? { kind: 'qualified', value: sum.toFixed(), qualifier: '>' }
    : { kind: 'value', value: sum.toFixed(), qualifier: null };
  return { each, total: judge(total, { max: definition.others_total }, rule) };
}

function aimsOf(definition: GradeDefinition, composition: Composition, rule: DecisionRule, warnings: string[]) {
  return (definition.aims ?? []).map((aim) => {
    const j = judge(composition.get(aim.element), aim, rule);
    const within = j.verdict === 'within' ? true : j.verdict === 'below_min' || j.verdict === 'above_max' ? false : null;
    if (within === false)
      warnings.push(`${aim.element} ${j.value} is outside the aim ${aim.min ?? ''}–${aim.max ?? ''} (a warning: aims are not limits).`);
    return { element: aim.element, value: j.value, aim_min: aim.min ?? null, aim_max: aim.max ?? null, within };
  });
}

function conformity(judgements: Judgement[]): boolean | null {
  if (judgements.some((j) => j.verdict === 'below_min' || j.verdict === 'above_max')) return false;
  if (judgements.some((j) => j.verdict !== 'within')) return null;
  return true;
}

export function evaluateComposition(definition: GradeDefinition, composition: Composition) {
  const rule = definition.decision_rule;
  const warnings: string[] = [];
  const remainder = definition.remainder_element ? remainderOf(composition, definition.remainder_element) : undefined;
  if (remainder?.approximate)
    warnings.push(`${definition.remainder_element} by difference counts "<", ">" and n.d. values at their bounds: it is approximate.`);
  const elements = definition.limits.map((limit) => {
    const m = limit.element === definition.remainder_element ? remainder!.value : composition.get(limit.element);
    return { element: limit.element, ...judge(m, limit, rule) };
  });
  const others = definition.others_each || definition.others_total ? othersOf(definition, composition, rule) : undefined;
  const aims = aimsOf(definition, composition, rule, warnings);
  const judged: Judgement[] = [...elements, ...(others?.each ?? []), ...(others?.total ? [others.total] : [])];
  return {
    conforms: conformity(judged),
    decision_rule: rule,
    elements,
    ...(remainder && definition.remainder_element
      ? {
          remainder: {
            element: definition.remainder_element,
            value: written(remainder.value)!,
            by_difference: true as const,
            approximate: remainder.approximate,
          },
        }
      : {}),
    ...(others ? { others } : {}),
    aims,
    warnings,
  };
}

/** The smallest margin over the numeric checks: how close the composition comes to failing the grade. */
export function smallestMargin(evaluation: ReturnType<typeof evaluateComposition>): string | null {
  const margins = [
    ...evaluation.elements,
    ...(evaluation.others?.each ?? []),
    ...(evaluation.others?.total ? [evaluation.others.total] : []),
  ]
    .map((j) => j.margin)
    .filter((m): m is string => m !== null);
  return margins.length === 0 ? null : Decimal.min(...margins).toFixed();
}
