// Plain logic of the control charts: linear scales from data to the SVG's box, the value range
// that fits every point and the ±3σ band, and the short human forms of values and rules.
import type { ChartPoint, ControlChart } from './api/control-samples.ts';
import { formatInstant } from '../../lib/timestamp.ts';

export interface Box {
  width: number;
  height: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
}

export type Scale = (value: number) => number;

export function linearScale(domain: [number, number], range: [number, number]): Scale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0 || 1;
  return (value) => r0 + ((value - d0) / span) * (r1 - r0);
}

/** The time axis of both charts: from the first to the last point (a day either side for one point). */
export function timeDomain(times: readonly string[]): [number, number] {
  const ms = times.map((t) => Date.parse(t));
  const min = Math.min(...ms);
  const max = Math.max(...ms);
  return min === max ? [min - 86_400_000, max + 86_400_000] : [min, max];
}

/** Values shown: every point and the ±3σ lines, with a little room above and below. */
export function valueDomain(chart: Pick<ControlChart, 'points' | 'sigma'>): [number, number] {
  const values = chart.points.map((p) => p.value);
  if (chart.sigma) values.push(chart.sigma.lower_3, chart.sigma.upper_3);
  const min = Math.min(...values);
  const max = Math.max(...values);
  const pad = (max - min || Math.abs(max) || 1) * 0.08;
  return [min - pad, max + pad];
}

/** Evenly spaced ticks over a domain (the bounds included). */
export function ticks([d0, d1]: [number, number], count: number): number[] {
  return Array.from({ length: count }, (_, i) => d0 + ((d1 - d0) * i) / (count - 1));
}

const VALUE = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 5, useGrouping: false });

/** A value in % for display (the API keeps full precision). */
export function formatValue(value: number | null): string {
  return value === null ? '—' : VALUE.format(value);
}

/** @deprecated The console's one clock: use <Timestamp> (or formatInstant in plain text). Kept for code still calling it. */
export function formatWhen(iso: string): string {
  return formatInstant(iso);
}

/** "11-03" for the time axis. */
export function formatDay(ms: number): string {
  return new Date(ms).toISOString().slice(5, 10);
}

/** Distance from the centre line in σ of the limits in force at the point, e.g. "+3.7σ". */
export function sigmaOffset(point: ChartPoint): string {
  if (point.centre === null || point.sd === null) return '—';
  const z = (point.value - point.centre) / point.sd;
  return `${z >= 0 ? '+' : '−'}${Math.abs(z).toFixed(1)}σ`;
}

/** What a reader (and a screen reader) is told about one point. */
export function describePoint(point: ChartPoint): string {
  const rules = point.violations.map((v) => v.title).join('; ');
  return [
    `${point.sample_code}, measured ${formatInstant(point.measured_at)}`,
    `value ${formatValue(point.value)} %`,
    `${point.burns_n} burns`,
    point.provisional ? 'provisional (limits not established yet)' : sigmaOffset(point),
    rules ? `breaks: ${rules}` : 'no rule broken',
  ].join(', ');
}

/** Rules broken by a run of points: how many points, ending at the one that completes it, make the run. */
const RUN_LENGTHS: Partial<Record<ChartPoint['violations'][number]['rule'], number>> = {
  eight_one_side: 8,
  nine_one_side: 9,
  six_trend: 6,
};

/** Index ranges [first, last] of the runs that break a rule, so the chart can outline them. */
export function runSpans(points: readonly ChartPoint[]): [number, number][] {
  const spans: [number, number][] = [];
  points.forEach((p, i) => {
    for (const v of p.violations) {
      const length = RUN_LENGTHS[v.rule];
      if (length) spans.push([Math.max(0, i - length + 1), i]);
    }
  });
  return spans;
}
