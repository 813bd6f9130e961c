// Control chart run rules, each named with its source (docs/references.md, "Control charts").
// Pure: a series of points, each with its own centre line and SD (the limits in force when it was
// measured), in measurement order. A violation is reported at the point that completes the pattern.
export const RUN_RULES = {
  beyond_3s: {
    title: 'One point beyond 3σ',
    source: 'Western Electric Statistical Quality Control Handbook (1956), test 1',
  },
  two_of_three_2s: {
    title: 'Two of three successive points beyond 2σ on the same side',
    source: 'Western Electric Statistical Quality Control Handbook (1956), test 2',
  },
  four_of_five_1s: {
    title: 'Four of five successive points beyond 1σ on the same side',
    source: 'Western Electric Statistical Quality Control Handbook (1956), test 3',
  },
  eight_one_side: {
    title: 'Eight successive points on the same side of the centre line',
    source: 'Western Electric Statistical Quality Control Handbook (1956), test 4',
  },
  nine_one_side: {
    title: 'Nine points in a row on the same side of the centre line',
    source: 'Nelson, Journal of Quality Technology 16(4), 1984, test 2',
  },
  six_trend: {
    title: 'Six points in a row steadily increasing or decreasing',
    source: 'Nelson, Journal of Quality Technology 16(4), 1984, test 3',
  },
} as const;

export type RunRule = keyof typeof RUN_RULES;
export const RUN_RULE_NAMES = Object.keys(RUN_RULES) as RunRule[];
/** Switched on for a new definition unless it says otherwise. */
export const DEFAULT_RULES: RunRule[] = ['beyond_3s', 'two_of_three_2s', 'four_of_five_1s', 'eight_one_side', 'six_trend'];

export interface ChartPoint {
  value: number;
  centre: number;
  sd: number;
}

/** Signed distance from the centre line in SDs. */
function zOf(point: ChartPoint): number {
  return (point.value - point.centre) / point.sd;
}

/** At least `need` of the last `window` points (ending at i, which must be one) beyond `k`σ on one side. */
function mOfN(z: number[], i: number, need: number, window: number, k: number): boolean {
  if (i + 1 < need) return false;
  const recent = z.slice(Math.max(0, i - window + 1), i + 1);
  const side = Math.sign(z[i]);
  if (side === 0 || Math.abs(z[i]) <= k) return false;
  return recent.filter((v) => Math.sign(v) === side && Math.abs(v) > k).length >= need;
}

/** The last `count` points (ending at i) all strictly on one side; a point on the line breaks the run. */
function run(z: number[], i: number, count: number): boolean {
  if (i + 1 < count) return false;
  const recent = z.slice(i - count + 1, i + 1);
  return recent.every((v) => v > 0) || recent.every((v) => v < 0);
}

/** `count` points in a row each strictly above (or each strictly below) the one before. */
function trend(values: number[], i: number, count: number): boolean {
  if (i + 1 < count) return false;
  const recent = values.slice(i - count + 1, i + 1);
  const steps = recent.slice(1).map((v, j) => Math.sign(v - recent[j]));
  return steps.every((s) => s > 0) || steps.every((s) => s < 0);
}

const CHECKS: Record<RunRule, (z: number[], values: number[], i: number) => boolean> = {
  beyond_3s: (z, _v, i) => Math.abs(z[i]) > 3,
  two_of_three_2s: (z, _v, i) => mOfN(z, i, 2, 3, 2),
  four_of_five_1s: (z, _v, i) => mOfN(z, i, 4, 5, 1),
  eight_one_side: (z, _v, i) => run(z, i, 8),
  nine_one_side: (z, _v, i) => run(z, i, 9),
  six_trend: (_z, values, i) => trend(values, i, 6),
};

/** For each point, the switched-on rules it completes (empty when none). */
export function judgeSeries(points: readonly ChartPoint[], rules: readonly RunRule[]): RunRule[][] {
  const z = points.map(zOf);
  const values = points.map((p) => p.value);
  return points.map((_, i) => rules.filter((rule) => CHECKS[rule](z, values, i)));
}

/** |x_i − x_(i−1)|; null for the first point. */
export function movingRanges(values: readonly number[]): (number | null)[] {
  return values.map((v, i) => (i === 0 ? null : Math.abs(v - values[i - 1])));
}
