// A control chart for one element of one control sample: each point (the drift-corrected mean of
// the sample's included burns, as stored in its results) judged with the limits in force when it
// was measured. Limits are the entered ones (each valid from its time until the next), or, before
// any entered limit applies, established from the first N points (mean and sample SD, n − 1);
// until N points exist those are provisional and no rule is applied (common practice, no source).
import { summarise } from '../chemistry/statistics.ts';
import { decodeResults } from '../samples/results-codec.ts';
import { type ChartPoint, judgeSeries, movingRanges, RUN_RULES, type RunRule } from './run-rules.ts';
import type { ControlLimitRow } from './control.repository.ts';

export interface StoredPoint {
  sample_id: string;
  sample_code: string;
  measured_at: string;
  results_json: string;
}

export interface LimitPeriod {
  centre: number;
  sd: number;
  source: string;
  established: boolean;
  provisional: boolean;
  valid_from: string | null;
  valid_to: string | null;
}

export interface JudgedPoint {
  sample_id: string;
  sample_code: string;
  measured_at: string;
  value: number;
  burns_n: number;
  centre: number | null;
  sd: number | null;
  provisional: boolean;
  violations: { rule: RunRule; title: string; source: string }[];
}

interface Measured {
  point: StoredPoint;
  value: number;
  n: number;
}

/** The numeric mean of one element of each point; qualified or withheld results are left out. */
function measuredValues(points: readonly StoredPoint[], element: string): Measured[] {
  const out: Measured[] = [];
  for (const point of points) {
    const result = decodeResults(point.results_json).find((r) => r.element === element);
    if (!result || result.mean === null || result.qualifier) continue;
    out.push({ point, value: Number(result.mean), n: result.n });
  }
  return out;
}

function establishedPeriod(values: Measured[], baselineN: number, firstEntered: string | null): LimitPeriod | null {
  const basis = values.slice(0, baselineN).map((v) => String(v.value));
  const summary = summarise(basis);
  if (summary.sd === null || summary.sd === 0 || summary.mean === null) return null;
  const provisional = basis.length < baselineN;
  return {
    centre: Number(summary.mean),
    sd: summary.sd,
    source: `established from the first ${basis.length} of ${baselineN} points`,
    established: true,
    provisional,
    valid_from: null,
    valid_to: firstEntered,
  };
}

function enteredPeriods(rows: readonly ControlLimitRow[]): LimitPeriod[] {
  return rows.map((row, i) => ({
    centre: Number(row.centre),
    sd: Number(row.sd),
    source: row.source,
    established: false,
    provisional: false,
    valid_from: row.valid_from,
    valid_to: rows[i + 1]?.valid_from ?? null,
  }));
}

/** The period in force at `time`: the last entered one from before it, else the established one. */
function periodAt(entered: LimitPeriod[], established: LimitPeriod | null, time: string): LimitPeriod | null {
  const inForce = entered.filter((p) => p.valid_from! <= time).at(-1);
  return inForce ?? established;
}

export function buildChart(input: {
  element: string;
  points: readonly StoredPoint[];
  limits: readonly ControlLimitRow[];
  rules: readonly RunRule[];
  baselineN: number;
}) {
  const values = measuredValues(input.points, input.element);
  const rows = input.limits.filter((l) => l.element === input.element);
  const entered = enteredPeriods(rows);
  const needsEstablished = values.some((v) => !periodAt(entered, null, v.point.measured_at));
  const established = needsEstablished ? establishedPeriod(values, input.baselineN, entered[0]?.valid_from ?? null) : null;
  const periods = values.map((v) => periodAt(entered, established, v.point.measured_at));
  // Rules run over the points judged with final limits; provisional ones are shown, not judged.
  const judgedIndex = values.map((_, i) => i).filter((i) => periods[i] && !periods[i]!.provisional);
  const series: ChartPoint[] = judgedIndex.map((i) => ({ value: values[i].value, centre: periods[i]!.centre, sd: periods[i]!.sd }));
  const verdicts = judgeSeries(series, input.rules);
  const violationsAt = new Map(judgedIndex.map((i, k) => [i, verdicts[k]]));
  const points: JudgedPoint[] = values.map((v, i) => ({
    sample_id: v.point.sample_id,
    sample_code: v.point.sample_code,
    measured_at: v.point.measured_at,
    value: v.value,
    burns_n: v.n,
    centre: periods[i]?.centre ?? null,
    sd: periods[i]?.sd ?? null,
    provisional: !periods[i] || periods[i]!.provisional,
    violations: (violationsAt.get(i) ?? []).map((rule) => ({ rule, ...RUN_RULES[rule] })),
  }));
  const ranges = movingRanges(values.map((v) => v.value));
  return {
    points,
    moving_ranges: points.slice(1).map((p, i) => ({ sample_id: p.sample_id, measured_at: p.measured_at, value: ranges[i + 1]! })),
    limits: [...(established ? [established] : []), ...entered],
  };
}
