// Plain logic of the drift chart: API points (decimal strings) → chart rows (numbers), round axis
// ticks, the warn/fail bands of the slope, and the short human forms shown in the table and tooltips.
// Activated runs make the line; drafts that were never activated are drawn as loose points off it,
// so a failed draft does not pull the line (it never corrected anything).
import type { DriftPoint } from './api/standardizations.ts';
import { formatInstant } from '../../lib/timestamp.ts';
import { offsetInUnit, type OffsetUnit } from './figures.ts';

export interface ChartRow {
  id: string;
  time: number;
  /** Activated runs only: the line. */
  slope: number | null;
  offset: number | null;
  /** Drafts only: loose points. */
  draftSlope: number | null;
  draftOffset: number | null;
  flag: DriftPoint['flag'];
  status: DriftPoint['status'];
  inForce: boolean;
}

export function toChartRows(points: readonly DriftPoint[], offsetUnit: OffsetUnit = '%'): ChartRow[] {
  return points.map((p) => {
    const slope = p.slope === null ? null : Number(p.slope);
    const offset = p.offset === null ? null : offsetInUnit(p.offset, offsetUnit);
    const activated = p.status === 'activated';
    return {
      id: p.standardization_id,
      time: Date.parse(p.measured_at),
      slope: activated ? slope : null,
      offset: activated ? offset : null,
      draftSlope: activated ? null : slope,
      draftOffset: activated ? null : offset,
      flag: p.flag,
      status: p.status,
      inForce: p.in_force,
    };
  });
}

/** A round step (1, 2 or 5 × 10ⁿ) giving about `count` intervals over `span`. */
function niceStep(span: number, count: number): number {
  const raw = span / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].find((f) => f * magnitude >= raw)! * magnitude;
  return step;
}

/** Round ticks covering the values (and `include`, e.g. slope 1), about five intervals. */
export interface AxisTicks {
  domain: [number, number];
  ticks: number[];
  /** Decimals that write every tick exactly. */
  decimals: number;
}

export function roundTicks(values: readonly (number | null)[], include: readonly number[] = []): AxisTicks {
  const all = [...values.filter((v): v is number => v !== null && Number.isFinite(v)), ...include];
  if (all.length === 0) return { domain: [0, 1], ticks: [0, 0.5, 1], decimals: 1 };
  let min = Math.min(...all);
  let max = Math.max(...all);
  if (min === max) {
    const pad = Math.abs(min) * 0.01 || 1;
    min -= pad;
    max += pad;
  }
  const step = niceStep(max - min, 5);
  const low = Math.floor(min / step) * step;
  const high = Math.ceil(max / step) * step;
  const decimals = Math.max(0, -Math.floor(Math.log10(step)));
  const ticks: number[] = [];
  for (let i = 0; low + i * step <= high + step / 1e6; i++) ticks.push(Number((low + i * step).toFixed(decimals)));
  return { domain: [ticks[0], ticks[ticks.length - 1]], ticks, decimals };
}

export interface SlopeBand {
  y1: number;
  y2: number;
  flag: 'warn' | 'fail';
}

/** The bands of the slope axis the method's limits make: warn between 1 ± warn and 1 ± fail, fail beyond. */
export function slopeBands(limits: { warn: string; fail: string }, domain: [number, number]): SlopeBand[] {
  const warn = Number(limits.warn);
  const fail = Number(limits.fail);
  const bands: SlopeBand[] = [
    { y1: 1 + warn, y2: 1 + fail, flag: 'warn' },
    { y1: 1 - fail, y2: 1 - warn, flag: 'warn' },
    { y1: 1 + fail, y2: Math.max(domain[1], 1 + fail), flag: 'fail' },
    { y1: Math.min(domain[0], 1 - fail), y2: 1 - fail, flag: 'fail' },
  ];
  // Only the parts inside the axis are drawn.
  return bands.map((b) => ({ ...b, y1: Math.max(b.y1, domain[0]), y2: Math.min(b.y2, domain[1]) })).filter((b) => b.y2 > b.y1);
}

const SHORT = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 5, useGrouping: false });

/** A long decimal string shown with 5 significant digits (display only: the API keeps every digit). */
export function shortDecimal(value: string | null): string {
  return value === null ? '—' : SHORT.format(Number(value));
}

/** @deprecated The console's one clock: use <Timestamp> (or formatInstant in plain text). Kept for code still calling it. */
export function formatTime(iso: string | number): string {
  return formatInstant(iso);
}

export function formatDay(time: number): string {
  return new Date(time).toISOString().slice(5, 10);
}
