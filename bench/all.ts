// `npm run bench`: ingest, push and read, each against its floor measured in the same run, one
// bench after the other (never two at once on a 2-core machine), then one table of every figure
// with its floor, ratio, target and result, written to bench/results.json as well.
// The benches run as child processes (bench/ingest.ts, bench/reads-and-pushes.ts) and leave their
// rows in bench/results-ingest.json and bench/results-api.json.
import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { type BenchRow, meets, printTable } from './bench-table.ts';

const BENCHES = [
  { script: 'bench/ingest.ts', results: 'results-ingest.json', node: ['--max-semi-space-size=64'] },
  { script: 'bench/reads-and-pushes.ts', results: 'results-api.json', node: [] },
];

const rows: BenchRow[] = [];
for (const bench of BENCHES) {
  console.log(`--- ${bench.script}`);
  const run = spawnSync(process.execPath, [...bench.node, '--import', 'tsx', bench.script], { stdio: 'inherit' });
  if (run.status !== 0) throw new Error(`${bench.script} exited with ${run.status}`);
  rows.push(...(JSON.parse(readFileSync(new URL(`./${bench.results}`, import.meta.url), 'utf8')) as { rows: BenchRow[] }).rows);
}
console.log('\n--- all figures (compare the ratios: the figures depend on the machine)');
printTable(rows);
const results = rows.map((row) => ({ ...row, ratio: row.value / row.floor, pass: meets(row) }));
writeFileSync(
  new URL('./results.json', import.meta.url),
  `${JSON.stringify({ measured_at: new Date().toISOString(), rows: results }, null, 2)}\n`,
);
