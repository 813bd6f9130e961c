// Times parseResultFile on the generated wide file (default 20,000 burns × 25 elements): the
// first run in a fresh process (what an upload sees) and the median of the following runs, as
// wall time and as CPU time (steadier on a shared machine; includes GC helper threads).
//
//   npx tsx bench/parse-wide-file.ts [burns] [runs]
import { parseResultFile } from '../server/domain/imports/parse/index.ts';
import { wideCsv } from './generate-wide-file.ts';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

export function timeParse(bytes: Buffer, runs: number) {
  const wall: number[] = [];
  const cpu: number[] = [];
  let counts = { rows: 0, burns: 0, values: 0 };
  for (let i = 0; i < runs; i += 1) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    counts = parseResultFile(bytes).counts;
    wall.push(performance.now() - start);
    const used = process.cpuUsage(cpuStart);
    cpu.push((used.user + used.system) / 1000);
  }
  const rest = runs > 1 ? 1 : 0;
  return {
    first_wall_ms: Math.round(wall[0]),
    first_cpu_ms: Math.round(cpu[0]),
    median_wall_ms: Math.round(median(wall.slice(rest))),
    median_cpu_ms: Math.round(median(cpu.slice(rest))),
    counts,
    values_per_s: Math.round(counts.values / (median(wall.slice(rest)) / 1000)),
  };
}

const [burns = '20000', runs = '7'] = process.argv.slice(2);
const bytes = Buffer.from(wideCsv(Number(burns)));
console.log({ megabytes: +(bytes.length / 1e6).toFixed(2), ...timeParse(bytes, Number(runs)) });
