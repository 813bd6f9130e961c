// One table for every bench figure: the figure, its floor measured in the same run, the ratio,
// the target and whether it is met. A target is a ratio to reach (product/floor, for rates), a
// ratio not to exceed (for durations), or an absolute bound in milliseconds.
export type BenchTarget = { ratioAtLeast: number } | { ratioAtMost: number } | { below: number } | null;

export interface BenchRow {
  figure: string;
  value: number;
  floor: number;
  target: BenchTarget;
}

export function targetText(target: BenchTarget): string {
  if (!target) return '—';
  if ('ratioAtLeast' in target) return `ratio ≥ ${target.ratioAtLeast}`;
  if ('ratioAtMost' in target) return `ratio ≤ ${target.ratioAtMost}`;
  return `< ${target.below} ms`;
}

export function meets(row: BenchRow): boolean | null {
  const { target } = row;
  if (!target) return null;
  const ratio = row.value / row.floor;
  if ('ratioAtLeast' in target) return ratio >= target.ratioAtLeast;
  if ('ratioAtMost' in target) return ratio <= target.ratioAtMost;
  return row.value < target.below;
}

export function printTable(rows: BenchRow[]): void {
  console.log(
    `${'figure'.padEnd(40)} ${'product'.padStart(10)} ${'floor'.padStart(10)} ${'ratio'.padStart(7)}  ${'target'.padEnd(12)} result`,
  );
  for (const row of rows) {
    const met = meets(row);
    console.log(
      `${row.figure.padEnd(40)} ${row.value.toFixed(1).padStart(10)} ${row.floor.toFixed(1).padStart(10)} ${(row.value / row.floor).toFixed(2).padStart(7)}  ${targetText(row.target).padEnd(12)} ${met === null ? '' : met ? 'pass' : 'MISS'}`,
    );
  }
}
