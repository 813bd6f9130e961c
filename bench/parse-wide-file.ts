// Times parseResultFile on the generated wide file (default 20,000 burns × 25 elements):
// the first run in a fresh process (what an upload sees) and the median of the next runs.
//
//   npx tsx bench/parse-wide-file.ts [burns] [runs]
import { parseResultFile } from '../server/domain/imports/parse/index.ts';
import { wideCsv } from './generate-wide-file.ts';

export function timeParse(bytes: Buffer, runs: number) {
  const times: number[] = [];
  let counts = { rows: 0, burns: 0, values: 0 };
  for (let i = 0; i < runs; i += 1) {
    const start = performance.now();
    counts = parseResultFile(bytes).counts;
    times.push(performance.now() - start);
  }
  const [first, ...rest] = times;
  const sorted = [...rest].sort((a, b) => a - b);
  const median = sorted.length > 0 ? sorted[Math.floor(sorted.length / 2)] : first;
  return { first_ms: Math.round(first), median_ms: Math.round(median), counts, values_per_s: Math.round(counts.values / (median / 1000)) };
}

const [burns = '20000', runs = '7'] = process.argv.slice(2);
const bytes = Buffer.from(wideCsv(Number(burns)));
console.log({ megabytes: +(bytes.length / 1e6).toFixed(2), ...timeParse(bytes, Number(runs)) });
