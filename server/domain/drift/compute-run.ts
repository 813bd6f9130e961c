// From the measured reference burns to per-element corrections with flags: the pure core of a
// standardization run (no database). Every element of the method gets a row; an element that
// cannot be corrected says why in its reasons, and arithmetic that cannot work (H = L) is
// collected as an error per element so that one 422 names them all.
import type { FieldError } from '../../lib/problems.ts';
import { exactMean } from '../chemistry/exact-mean.ts';
import { repeatabilityCheck } from '../chemistry/repeatability.ts';
import type { Method } from '../methods/methods.repository.ts';
import type { NewBurn } from '../samples/sample-builder.ts';
import {
  type Correction,
  CorrectionMathError,
  type CorrectionMode,
  type Level,
  onePointFactor,
  onePointOffset,
  twoPoint,
  typeCorrection,
} from './correction-math.ts';
import { agreementFlag, changeFlag, type FlagResult, limitFlags, spanFlag, worstFlag } from './correction-flags.ts';
import type { ReferenceMaterial } from './reference-materials.repository.ts';
import type { ElementCorrection, ElementLevel, StoredMeasurement } from './standardizations.repository.ts';

export interface RunMeasurement {
  reference: ReferenceMaterial;
  burns: Pick<NewBurn, 'values' | 'raw'>[];
}

export interface RunInput {
  mode: CorrectionMode;
  method: Method;
  /** two_point: one `high` and one `low` reference; other modes: exactly one reference. */
  measurements: RunMeasurement[];
  /** The set in force now, per element (previous values; the base of a type standardization). */
  inForce: ReadonlyMap<string, Correction> | null;
}

export interface RunOutput {
  corrections: ElementCorrection[];
  measurements: StoredMeasurement[];
  errors: FieldError[];
}

function numericValues(burns: RunMeasurement['burns'], element: string): string[] {
  return burns.map((b) => b.values[element]).flatMap((cell) => (cell && cell.q === null && cell.v !== null ? [cell.v] : []));
}

function summariseMeasurement(m: RunMeasurement): StoredMeasurement {
  const elements = new Set(m.burns.flatMap((b) => Object.keys(b.values)));
  const means: Record<string, string> = {};
  for (const element of [...elements].sort()) {
    const values = numericValues(m.burns, element);
    if (values.length) means[element] = exactMean(values);
  }
  const { id, code, name, kind } = m.reference;
  return { reference_material: { id, code, name, kind }, burns: m.burns.map((b) => ({ values: b.values, raw: b.raw })), means };
}

function levelOf(m: RunMeasurement, summary: StoredMeasurement, element: string): ElementLevel {
  return {
    reference_material_id: m.reference.id,
    code: m.reference.code,
    kind: m.reference.kind,
    nominal: m.reference.values.find((v) => v.element === element)?.nominal ?? null,
    measured: summary.means[element] ?? null,
    n: numericValues(m.burns, element).length,
  };
}

function missingReasons(element: string, levels: ElementLevel[]): string[] {
  const reasons = levels.flatMap((level) => [
    ...(level.nominal === null ? [`${level.code} gives no nominal value for ${element}.`] : []),
    ...(level.measured === null
      ? [`${level.code} has no numeric measurement of ${element} (not measured, or only "<", ">" or n.d.).`]
      : []),
  ]);
  return reasons.length
    ? [...reasons, `${element} is therefore not corrected by this set: its results stay uncorrected while the set is in force.`]
    : [];
}

function compute(mode: CorrectionMode, levels: Level[], base: Correction | null): Correction {
  if (mode === 'two_point') return twoPoint(levels[0], levels[1]);
  if (mode === 'one_point_factor') return onePointFactor(levels[0]);
  if (mode === 'one_point_offset') return onePointOffset(levels[0]);
  return typeCorrection(levels[0], base);
}

/** Orders the measurements as the mode reads them: [high, low] for two_point. */
function ordered(input: RunInput): RunMeasurement[] {
  if (input.mode !== 'two_point') return input.measurements;
  const high = input.measurements.find((m) => m.reference.kind === 'high')!;
  const low = input.measurements.find((m) => m.reference.kind === 'low')!;
  return [high, low];
}

export function computeRun(input: RunInput): RunOutput {
  const measurements = ordered(input);
  const summaries = measurements.map(summariseMeasurement);
  const errors: FieldError[] = [];
  const corrections: ElementCorrection[] = [];
  for (const settings of input.method.elements) {
    const { element } = settings;
    const levels = measurements.map((m, i) => levelOf(m, summaries[i], element));
    const previous = input.inForce?.get(element) ?? null;
    const row: ElementCorrection = {
      element,
      slope: null,
      offset: null,
      previous_slope: previous?.slope ?? null,
      previous_offset: previous?.offset ?? null,
      flag: 'ok',
      reasons: [],
      levels,
    };
    const missing = missingReasons(element, levels);
    const found: FlagResult[] = missing.length ? [{ flag: 'warn', reason: missing.join(' ') }] : [];
    if (!missing.length) {
      const known = levels as (ElementLevel & Level)[];
      try {
        const correction = compute(input.mode, known, previous);
        row.slope = correction.slope;
        row.offset = correction.offset;
        found.push(...limitFlags(input.mode, correction, input.method.drift_limits, input.method.code, known[0]));
        const moved = changeFlag(correction.slope, row.previous_slope, input.method.drift_limits, input.method.code);
        if (moved) found.push(moved);
        if (input.mode === 'two_point') {
          const span = spanFlag(known[0], known[1], known[0].code, known[1].code);
          if (span) found.push(span);
        }
      } catch (error) {
        if (!(error instanceof CorrectionMathError)) throw error;
        errors.push({ location: `body.measurements.${element}`, message: `${element}: ${error.message}.`, code: 'no_correction' });
      }
    }
    if (settings.repeatability_sd) {
      measurements.forEach((m) => {
        const values = numericValues(m.burns, element);
        const flag = agreementFlag(
          repeatabilityCheck(values, settings.repeatability_sd as string),
          values.length,
          settings.repeatability_sd as string,
          m.reference.code,
        );
        if (flag) found.push(flag);
      });
    }
    row.flag = worstFlag(found.map((f) => f.flag));
    row.reasons = found.map((f) => f.reason);
    corrections.push(row);
  }
  return { corrections, measurements: summaries, errors };
}
