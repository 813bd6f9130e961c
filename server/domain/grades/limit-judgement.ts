// One measured value against one element's limits, under a stated decision rule.
//   rounding (ASTM E29, ISO 80000-1 rule A): the value is rounded half to even, once, to the last
//   place written in each limit (0.40 → hundredths, 0.8 → tenths), from its decimal value, then compared.
//   absolute: the value as measured is compared; any excess fails.
// A qualified value is a bound: "<0.002" means somewhere in [0, 0.002). It decides only when every
// value it allows gives the same answer; otherwise the verdict is "undetermined", never "within".
import { Decimal } from 'decimal.js';
import type { MeasuredValue } from '../chemistry/measured-value.ts';
import { decimalsOf, roundHalfEven } from '../chemistry/rounding.ts';

export type DecisionRule = 'rounding' | 'absolute';
export type Verdict = 'within' | 'below_min' | 'above_max' | 'not_measured' | 'undetermined';
type Side = 'ok' | 'fail' | 'undetermined';

export interface Limits {
  min?: string;
  max?: string;
}

export interface Judgement {
  verdict: Verdict;
  /** The value as given ("0.452", "<0.002"), null when not measured. */
  value: string | null;
  /** The value rounded to the place of the limit that applies (rounding rule only). */
  rounded: string | null;
  limit_min: string | null;
  limit_max: string | null;
  /** Distance from the compared value to the nearest limit: ≥ 0 within, < 0 beyond; null for bounds. */
  margin: string | null;
}

/** The value as compared with this limit: rounded to its written place, or as measured. */
function compared(value: string, limit: string, rule: DecisionRule): Decimal {
  return new Decimal(rule === 'rounding' ? roundHalfEven(value, decimalsOf(limit)) : value);
}

function maxSide(m: MeasuredValue, max: string, rule: DecisionRule): Side {
  if (m.kind === 'value') return compared(m.value, max, rule).gt(max) ? 'fail' : 'ok';
  if (m.kind !== 'qualified') return 'undetermined';
  const bound = compared(m.value, max, rule);
  if (m.qualifier === '<') return bound.lte(max) ? 'ok' : 'undetermined';
  return (rule === 'rounding' ? bound.gt(max) : bound.gte(max)) ? 'fail' : 'undetermined';
}

function minSide(m: MeasuredValue, min: string, rule: DecisionRule): Side {
  if (m.kind === 'value') return compared(m.value, min, rule).lt(min) ? 'fail' : 'ok';
  if (m.kind !== 'qualified') return 'undetermined';
  const bound = compared(m.value, min, rule);
  if (m.qualifier === '>') return bound.gte(min) ? 'ok' : 'undetermined';
  return (rule === 'rounding' ? bound.lt(min) : bound.lte(min)) ? 'fail' : 'undetermined';
}

export function written(m: MeasuredValue | undefined): string | null {
  if (!m || m.kind === 'blank') return null;
  if (m.kind === 'not_detected') return 'n.d.';
  return m.kind === 'qualified' ? `${m.qualifier}${m.value}` : m.value;
}

function margin(m: MeasuredValue, limits: Limits, rule: DecisionRule): string | null {
  if (m.kind !== 'value') return null;
  const distances = [
    limits.min === undefined ? null : compared(m.value, limits.min, rule).minus(limits.min),
    limits.max === undefined ? null : new Decimal(limits.max).minus(compared(m.value, limits.max, rule)),
  ].filter((d): d is Decimal => d !== null);
  return Decimal.min(...distances).toFixed();
}

function roundedFor(m: MeasuredValue, limits: Limits, rule: DecisionRule): string | null {
  const place = limits.max ?? limits.min;
  if (rule !== 'rounding' || place === undefined || (m.kind !== 'value' && m.kind !== 'qualified')) return null;
  const rounded = roundHalfEven(m.value, decimalsOf(place));
  return m.kind === 'qualified' ? `${m.qualifier}${rounded}` : rounded;
}

export function judge(m: MeasuredValue | undefined, limits: Limits, rule: DecisionRule): Judgement {
  const base = { value: written(m), limit_min: limits.min ?? null, limit_max: limits.max ?? null };
  if (!m || m.kind === 'blank') return { ...base, verdict: 'not_measured', rounded: null, margin: null };
  const low = limits.min === undefined ? 'ok' : minSide(m, limits.min, rule);
  const high = limits.max === undefined ? 'ok' : maxSide(m, limits.max, rule);
  const verdict: Verdict =
    low === 'fail'
      ? 'below_min'
      : high === 'fail'
        ? 'above_max'
        : low === 'undetermined' || high === 'undetermined'
          ? 'undetermined'
          : 'within';
  return { ...base, verdict, rounded: roundedFor(m, limits, rule), margin: margin(m, limits, rule) };
}
