// Control sample definitions: create, change (new limits keep the old ones with their validity),
// list with the latest status, and the chart of one element.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { parseJsonColumn } from '../../lib/json.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import { type FieldError, NotFoundProblem, UnprocessableProblem, ConflictProblem } from '../../lib/problems.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { normaliseElement } from '../chemistry/elements.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed } from '../instruments/instruments.service.ts';
import { findMethod } from '../methods/methods.repository.ts';
import { buildChart } from './control-chart.ts';
import { currentStatus } from './control-status.ts';
import {
  type ControlLimitRow,
  type ControlSampleRow,
  findControlSample,
  findControlSampleByCode,
  insertControlSample,
  insertLimits,
  latestPointAt,
  limitsOf,
  listControlSampleRows,
  pointsWithResults,
  updateControlSampleRow,
} from './control.repository.ts';
import type {
  ChartQuerySchema,
  ControlLimitInputSchema,
  ControlSampleListQuerySchema,
  ControlSampleSchema,
  CreateControlSampleRequestSchema,
  UpdateControlSampleRequestSchema,
} from './control.schemas.ts';
import { DEFAULT_RULES, RUN_RULE_NAMES, RUN_RULES, type RunRule } from './run-rules.ts';

type ControlSample = z.input<typeof ControlSampleSchema>;
type LimitInput = z.output<typeof ControlLimitInputSchema>;

export function rulesOf(row: ControlSampleRow): RunRule[] {
  return parseJsonColumn(row.rules_json) as RunRule[];
}

async function toControlSample(db: Queryable, row: ControlSampleRow): Promise<ControlSample> {
  const limits = await limitsOf(db, row.id);
  return {
    id: row.id,
    instrument_id: row.instrument_id,
    method_id: row.method_id,
    code: row.code,
    description: row.description,
    kind: row.kind as ControlSample['kind'],
    elements: parseJsonColumn(row.elements_json) as string[],
    rules: rulesOf(row),
    baseline_n: row.baseline_n,
    limits: limits.map((l) => ({ element: l.element, centre: l.centre, sd: l.sd, source: l.source, valid_from: l.valid_from })),
    status: (await currentStatus(db, row.instrument_id, row.method_id)).status,
    latest_point_at: await latestPointAt(db, row.id),
    created_at: row.created_at,
    updated_at: row.updated_at,
  };
}

/** Element symbols in canonical case; unknown ones are errors. */
function limitRows(inputs: LimitInput[], controlSampleId: string, label: string, now: string, errors: FieldError[], at: string) {
  const elements: string[] = [];
  const rows: ControlLimitRow[] = [];
  for (const [i, input] of inputs.entries()) {
    const element = normaliseElement(input.element);
    if (!element) {
      errors.push({ location: `${at}.${i}.element`, message: `"${input.element}" is not an element symbol`, code: 'unknown_element' });
      continue;
    }
    elements.push(element);
    if (input.centre === undefined || input.sd === undefined) continue;
    rows.push({
      id: newId('lim'),
      control_sample_id: controlSampleId,
      element,
      centre: input.centre,
      sd: input.sd,
      source: input.source!,
      valid_from: input.valid_from ? new Date(input.valid_from).toISOString() : now,
      created_by_label: label,
      created_at: now,
    });
  }
  return { elements, rows };
}

export async function loadControlSample(db: Queryable, auth: AuthContext, id: string): Promise<ControlSampleRow> {
  const row = await findControlSample(db, id);
  if (!row || (auth.instrumentIds && !auth.instrumentIds.includes(row.instrument_id)))
    throw new NotFoundProblem(`No control sample ${id}.`);
  return row;
}

export async function createControlSample(
  ctx: Pick<AppContext, 'db'>,
  auth: AuthContext,
  input: z.output<typeof CreateControlSampleRequestSchema>,
  requestId?: string,
): Promise<ControlSample> {
  assertInstrumentAllowed(auth, input.instrument_id);
  return inTransaction(ctx.db, async (trx) => {
    const errors: FieldError[] = [];
    if (!(await findInstrument(trx, input.instrument_id)))
      errors.push({ location: 'body.instrument_id', message: `no instrument ${input.instrument_id}`, code: 'unknown_reference' });
    if (!(await findMethod(trx, input.method_id)))
      errors.push({ location: 'body.method_id', message: `no method ${input.method_id}`, code: 'unknown_reference' });
    const id = newId('ctl');
    const now = nowIso();
    const { elements, rows } = limitRows(input.elements, id, actorOf(auth).label, now, errors, 'body.elements');
    if (new Set(elements).size !== elements.length) errors.push({ location: 'body.elements', message: 'list each element once' });
    if (errors.length) throw new UnprocessableProblem('The control sample cannot be defined; see errors[].', errors);
    if (await findControlSampleByCode(trx, input.instrument_id, input.method_id, input.code))
      throw new ConflictProblem(`A control sample ${input.code} exists for this instrument and method.`);
    const row: ControlSampleRow = {
      id,
      instrument_id: input.instrument_id,
      method_id: input.method_id,
      code: input.code,
      description: input.description,
      kind: input.kind,
      elements_json: JSON.stringify(elements),
      rules_json: JSON.stringify(input.rules ?? DEFAULT_RULES),
      baseline_n: input.baseline_n,
      created_at: now,
      updated_at: now,
    };
    await insertControlSample(trx, row);
    await insertLimits(trx, rows);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'control_sample.created',
      targetType: 'control_sample',
      targetId: id,
      after: { ...row, limits: rows },
    });
    return toControlSample(trx, row);
  });
}

export async function updateControlSample(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  input: z.output<typeof UpdateControlSampleRequestSchema>,
  requestId?: string,
): Promise<ControlSample> {
  return inTransaction(ctx.db, async (trx) => {
    const before = await loadControlSample(trx, auth, id);
    const now = nowIso();
    const errors: FieldError[] = [];
    const { elements, rows } = limitRows(input.limits ?? [], id, actorOf(auth).label, now, errors, 'body.limits');
    const charted = parseJsonColumn(before.elements_json) as string[];
    for (const [i, element] of elements.entries())
      if (!charted.includes(element))
        errors.push({ location: `body.limits.${i}.element`, message: `${element} is not charted on this control sample` });
    if (errors.length) throw new UnprocessableProblem('The limits cannot be changed; see errors[].', errors);
    const changes: Partial<ControlSampleRow> = { updated_at: now };
    if (input.description !== undefined) changes.description = input.description;
    if (input.rules) changes.rules_json = JSON.stringify(input.rules);
    await updateControlSampleRow(trx, id, changes);
    await insertLimits(trx, rows);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'control_sample.updated',
      targetType: 'control_sample',
      targetId: id,
      before,
      after: { ...changes, limits: rows },
    });
    return toControlSample(trx, { ...before, ...changes });
  });
}

export async function getControlSample(ctx: AppContext, auth: AuthContext, id: string): Promise<ControlSample> {
  return toControlSample(ctx.db, await loadControlSample(ctx.db, auth, id));
}

export async function listControlSamples(
  ctx: AppContext,
  auth: AuthContext,
  query: z.output<typeof ControlSampleListQuerySchema>,
): Promise<Page<ControlSample>> {
  const page = await listControlSampleRows(ctx.db, { onlyInstrumentIds: auth.instrumentIds, instrumentId: query.instrument_id }, query);
  const data = await Promise.all(page.data.map((row) => toControlSample(ctx.db, row)));
  return mapPage({ ...page, data }, (x) => x);
}

/** The chart of one element, judged over every point; from/to only narrow what is returned. */
export async function chartOf(db: Queryable, row: ControlSampleRow, element: string, range: { from?: string; to?: string } = {}) {
  const rules = rulesOf(row);
  const chart = buildChart({
    element,
    points: await pointsWithResults(db, row.id),
    limits: await limitsOf(db, row.id),
    rules,
    baselineN: row.baseline_n,
  });
  const from = range.from ? new Date(range.from).toISOString() : '';
  const to = range.to ? new Date(range.to).toISOString() : '9999';
  const inRange = (t: string) => t >= from && t <= to;
  const current = chart.limits.at(-1) ?? null;
  return {
    control_sample_id: row.id,
    element,
    unit: '%' as const,
    provisional: !current || current.provisional,
    centre: current?.centre ?? null,
    sigma: current && {
      upper_1: current.centre + current.sd,
      upper_2: current.centre + 2 * current.sd,
      upper_3: current.centre + 3 * current.sd,
      lower_1: current.centre - current.sd,
      lower_2: current.centre - 2 * current.sd,
      lower_3: current.centre - 3 * current.sd,
    },
    limits: chart.limits,
    points: chart.points.filter((p) => inRange(p.measured_at)),
    moving_ranges: chart.moving_ranges.filter((p) => inRange(p.measured_at)),
    rules: RUN_RULE_NAMES.map((rule) => ({ rule, ...RUN_RULES[rule], enabled: rules.includes(rule) })),
  };
}

export async function getChart(ctx: AppContext, auth: AuthContext, id: string, query: z.output<typeof ChartQuerySchema>) {
  const row = await loadControlSample(ctx.db, auth, id);
  const element = normaliseElement(query.element);
  const charted = parseJsonColumn(row.elements_json) as string[];
  if (!element || !charted.includes(element))
    throw new UnprocessableProblem(`${query.element} is not charted on ${row.code}; charted: ${charted.join(', ')}.`);
  return chartOf(ctx.db, row, element, query);
}
