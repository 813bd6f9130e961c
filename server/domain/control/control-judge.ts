// Links new control measurements to their definition and judges them: a sample of kind `control`
// by its control_sample_id (JSON push) or by its code matching a definition for its instrument and
// method (file import). A point that breaks a switched-on rule sets the instrument to `verify` for
// the method and records control.out_of_control, in the transaction that stored the sample.
import type { Transaction } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { parseJsonColumn } from '../../lib/json.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import { recordEvent } from '../events/events.repository.ts';
import type { BurnRow, SampleRow } from '../samples/samples.repository.ts';
import { queueAlert } from '../alerts/alerts.service.ts';
import { chartOf } from './control.service.ts';
import {
  type ControlSampleRow,
  findControlPoint,
  findControlSample,
  findControlSampleByCode,
  insertControlPoints,
  insertStatusChange,
} from './control.repository.ts';
import type { StatusViolation } from './control-status.ts';

type Built = { sample: SampleRow; burns: BurnRow[] };

function measuredAt(built: Built): string {
  const times = built.burns
    .map((b) => b.measured_at)
    .filter((t): t is string => !!t)
    .sort();
  return times[0] ?? built.sample.created_at;
}

async function definitionFor(trx: Transaction, sample: SampleRow, explicit: string | undefined, index: number) {
  if (explicit) {
    const row = await findControlSample(trx, explicit);
    if (!row || row.instrument_id !== sample.instrument_id || row.method_id !== sample.method_id)
      throw new UnprocessableProblem(`No control sample ${explicit} is defined for this sample's instrument and method.`, [
        {
          location: index >= 0 ? `body.samples.${index}.control_sample_id` : 'body.control_sample_id',
          message: `no control sample ${explicit} for this instrument and method`,
          code: 'unknown_reference',
        },
      ]);
    return row;
  }
  // A file import may not say the kind: a sample code matching a definition is enough there.
  if (sample.kind !== 'control' && !(sample.source === 'import' && sample.kind === null)) return undefined;
  return findControlSampleByCode(trx, sample.instrument_id, sample.method_id, sample.sample_code);
}

/**
 * Finds the definition each new sample is a measurement of, before the samples are stored: a
 * sample linked by its code without a kind becomes kind `control` in what is stored.
 */
export async function resolveControlLinks(
  trx: Transaction,
  built: Built[],
  explicitIds: (string | undefined)[] = [],
  batch = false,
): Promise<(ControlSampleRow | undefined)[]> {
  const links: (ControlSampleRow | undefined)[] = [];
  for (const [i, b] of built.entries()) {
    const definition = await definitionFor(trx, b.sample, explicitIds[i], batch ? i : -1);
    links.push(definition);
    if (!definition) continue;
    if (b.sample.kind === null) b.sample.kind = 'control';
    if (b.sample.kind !== 'control')
      throw new UnprocessableProblem(`${b.sample.sample_code} is linked to a control sample, so its kind must be control.`);
  }
  return links;
}

/** Records the links of the stored samples that are control measurements, then judges each. */
export async function linkControlMeasurements(trx: Transaction, built: Built[], links: (ControlSampleRow | undefined)[]): Promise<void> {
  for (const [i, b] of built.entries()) {
    const definition = links[i];
    if (!definition) continue;
    await insertControlPoints(trx, [{ sample_id: b.sample.id, control_sample_id: definition.id, measured_at: measuredAt(b) }]);
    await judgeControlPoint(trx, definition, b.sample.id);
  }
}

/** Judges a control point again after its burns changed (excluded or included). */
export async function rejudgeControlPoint(trx: Transaction, sampleId: string): Promise<void> {
  const point = await findControlPoint(trx, sampleId);
  if (!point) return;
  await judgeControlPoint(trx, (await findControlSample(trx, point.control_sample_id))!, sampleId);
}

async function judgeControlPoint(trx: Transaction, definition: ControlSampleRow, sampleId: string): Promise<void> {
  const violations: (StatusViolation & { value: number; centre: number | null; sd: number | null })[] = [];
  let at: string | null = null;
  let sampleCode = '';
  for (const element of parseJsonColumn(definition.elements_json) as string[]) {
    const chart = await chartOf(trx, definition, element);
    const point = chart.points.find((p) => p.sample_id === sampleId);
    if (!point) continue;
    at = point.measured_at;
    sampleCode = point.sample_code;
    for (const v of point.violations) violations.push({ element, ...v, value: point.value, centre: point.centre, sd: point.sd });
  }
  if (violations.length === 0 || !at) return;
  const now = new Date().toISOString();
  await insertStatusChange(trx, {
    id: newId('cst'),
    instrument_id: definition.instrument_id,
    method_id: definition.method_id,
    status: 'verify',
    control_sample_id: definition.id,
    sample_id: sampleId,
    measured_at: at,
    violations_json: JSON.stringify(violations.map(({ element, rule, title, source }) => ({ element, rule, title, source }))),
    cause: null,
    action: null,
    created_by_label: 'system',
    created_at: now,
  });
  const data = {
    instrument_id: definition.instrument_id,
    method_id: definition.method_id,
    status: 'verify',
    control_sample: { id: definition.id, code: definition.code },
    sample: { id: sampleId, sample_code: sampleCode, measured_at: at },
    violations,
  };
  await recordEvent(trx, 'control.out_of_control', data, { instrumentId: definition.instrument_id });
  const rules = violations.map((v) => `${v.element}: ${v.title} (${v.source}); value ${v.value} %, centre ${v.centre} %, SD ${v.sd} %`);
  await queueAlert(trx, {
    kind: 'control_out_of_control',
    instrumentId: definition.instrument_id,
    subject: `Control ${definition.code} out of control`,
    lines: [`Control sample ${definition.code}, point ${sampleCode} measured ${at}:`, ...rules.map((r) => `  - ${r}`)],
    path: `/control-samples/${definition.id}`,
  });
}
