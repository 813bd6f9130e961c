// Times the per-element result computation at the ingest benchmark's volume: 20 000 burns × 25
// elements = 500 000 values, 3 burns per sample (166 675 sample × element groups), values with 4
// decimals like a spark OES export. Run: npx tsx bench/chemistry-statistics.ts
// The decimal.js mean is printed as a reference point: it is what exact-mean.ts avoids.
import { computeElementResult, type BurnCell } from '../server/domain/chemistry/element-result.ts';
import { decimalMean } from '../server/domain/chemistry/exact-mean.ts';
import { summarise } from '../server/domain/chemistry/statistics.ts';

const BURNS = 20_000;
const ELEMENTS = 25;
const BURNS_PER_SAMPLE = 3;
const RUNS = 7;

let seed = 12345; // deterministic linear congruential generator: the same data on every run
function next(): number {
  seed = (seed * 1103515245 + 12345) % 2147483648;
  return seed / 2147483648;
}

const groups: string[][] = [];
for (let sample = 0; sample < Math.ceil(BURNS / BURNS_PER_SAMPLE); sample++) {
  for (let element = 0; element < ELEMENTS; element++) {
    const level = 0.001 + next() * (element + 1);
    groups.push(Array.from({ length: BURNS_PER_SAMPLE }, () => (level * (1 + (next() - 0.5) * 0.02)).toFixed(4)));
  }
}
const valueCount = groups.reduce((total, group) => total + group.length, 0);
const cellGroups: BurnCell[][] = groups.map((group) => group.map((value) => ({ value, qualifier: null })));
const settings = { decimals: 4, detection_limit: '0.0005', working_range_low: '0.001', working_range_high: '30', repeatability_sd: '0.01' };

function time(label: string, run: () => void): void {
  const runs: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const start = performance.now();
    run();
    runs.push(performance.now() - start);
  }
  runs.sort((a, b) => a - b);
  const median = runs[Math.floor(RUNS / 2)];
  const rate = Math.round(valueCount / (median / 1000)).toLocaleString('en');
  console.log(`${label.padEnd(58)} median ${median.toFixed(0).padStart(5)} ms  (${rate} values/s)`);
}

console.log(`${valueCount} values in ${groups.length} groups of ${BURNS_PER_SAMPLE}, median of ${RUNS} runs`);
time('reference: decimal.js mean only', () => {
  for (const group of groups) decimalMean(group);
});
time('summarise: mean, SD, RSD, min, max', () => {
  for (const group of groups) summarise(group);
});
time('computeElementResult: + limits, rounding, repeatability', () => {
  for (const cells of cellGroups) computeElementResult({ element: 'Mn', cells, settings });
});
