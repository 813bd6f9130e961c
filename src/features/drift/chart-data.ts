// Plain logic of the drift chart: API points (decimal strings) → chart rows (numbers), and the
// short human forms shown in the table and tooltips.
import type { DriftPoint } from './api/standardizations.ts';
import { formatInstant } from '../../lib/timestamp.ts';

export interface ChartRow {
  id: string;
  time: number;
  slope: number | null;
  offset: number | null;
  flag: DriftPoint['flag'];
  status: DriftPoint['status'];
  inForce: boolean;
}

export function toChartRows(points: readonly DriftPoint[]): ChartRow[] {
  return points.map((p) => ({
    id: p.standardization_id,
    time: Date.parse(p.measured_at),
    slope: p.slope === null ? null : Number(p.slope),
    offset: p.offset === null ? null : Number(p.offset),
    flag: p.flag,
    status: p.status,
    inForce: p.in_force,
  }));
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
