// Writes a deterministic wide result file (a row per burn, a column per element) for benchmarks:
// 3 burns per sample, two samples (preliminary, final) per heat, 25 elements of a low-alloy
// steel. All values are invented; ranges are plausible for carbon and low-alloy steel
// (common practice, no source). Same arguments → byte-identical file.
//
//   npx tsx bench/generate-wide-file.ts out.csv 20000
import { writeFile } from 'node:fs/promises';
import { pathToFileURL } from 'node:url';

/** Element, lowest and highest plausible value in %, decimals written. Fe is the balance. */
const ELEMENT_RANGES: [string, number, number, number][] = [
  ['C', 0.15, 0.5, 3],
  ['Si', 0.15, 0.4, 3],
  ['Mn', 0.5, 1.2, 3],
  ['P', 0.005, 0.03, 4],
  ['S', 0.003, 0.03, 4],
  ['Cr', 0.05, 1.1, 3],
  ['Mo', 0.01, 0.25, 3],
  ['Ni', 0.02, 0.6, 3],
  ['Al', 0.015, 0.05, 4],
  ['Co', 0.003, 0.015, 4],
  ['Cu', 0.05, 0.3, 3],
  ['Nb', 0.001, 0.04, 4],
  ['Ti', 0.001, 0.03, 4],
  ['V', 0.002, 0.08, 4],
  ['W', 0.005, 0.03, 4],
  ['Pb', 0.0005, 0.003, 4],
  ['Sn', 0.003, 0.015, 4],
  ['As', 0.002, 0.01, 4],
  ['Zr', 0.001, 0.005, 4],
  ['Bi', 0.0005, 0.002, 4],
  ['Ca', 0.0002, 0.003, 4],
  ['B', 0.0001, 0.003, 4],
  ['N', 0.004, 0.012, 4],
  ['Sb', 0.001, 0.005, 4],
];
export const WIDE_FILE_ELEMENTS = [...ELEMENT_RANGES.map(([symbol]) => symbol), 'Fe'];

export interface WideFileOptions {
  burnsPerSample?: number;
  delimiter?: ',' | ';' | '\t';
  seed?: number;
}

/** mulberry32: a tiny deterministic PRNG, so the file does not depend on Math.random. */
function random(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The file's text: a header line and `burns` data lines, each ending in "\n". */
export function wideCsv(burns: number, options: WideFileOptions = {}): string {
  const per = options.burnsPerSample ?? 3;
  const d = options.delimiter ?? ',';
  const next = random(options.seed ?? 412);
  const header = ['Sample', 'Heat', 'Grade', 'Kind', 'Burn', 'Time', ...ELEMENT_RANGES.map(([symbol]) => `${symbol} %`), 'Fe %'];
  const lines = [header.join(d)];
  const start = Date.UTC(2024, 2, 4, 6, 0, 0);
  let base: number[] = [];
  for (let i = 0; i < burns; i += 1) {
    const sample = Math.floor(i / per);
    const burn = (i % per) + 1;
    if (burn === 1) base = ELEMENT_RANGES.map(([, low, high]) => low + next() * (high - low));
    const heat = `K24-${String(412 + Math.floor(sample / 2)).padStart(4, '0')}`;
    const kind = sample % 2 === 0 ? 'preliminary' : 'final';
    const grade = Math.floor(sample / 2) % 2 === 0 ? 'SAE 1045' : 'SAE 1018';
    const time = new Date(start + i * 40_000).toISOString().replace('.000Z', 'Z');
    let total = 0;
    const values = ELEMENT_RANGES.map(([, , , decimals], k) => {
      const value = base[k] * (1 + (next() - 0.5) * 0.02); // ±1 % between burns
      const written = value.toFixed(decimals);
      total += Number(written);
      return written;
    });
    values.push((100 - total).toFixed(3));
    lines.push([`${heat}-${kind === 'preliminary' ? 'P' : 'F'}1`, heat, grade, kind, String(burn), time, ...values].join(d));
  }
  return `${lines.join('\n')}\n`;
}

/** Writes the file and says what is in it. */
export async function generateWideFile(path: string, burns: number, options: WideFileOptions = {}) {
  const text = wideCsv(burns, options);
  await writeFile(path, text, 'utf8');
  const per = options.burnsPerSample ?? 3;
  return { path, bytes: Buffer.byteLength(text), burns, samples: Math.ceil(burns / per), values: burns * WIDE_FILE_ELEMENTS.length };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const [path = 'wide.csv', burns = '20000'] = process.argv.slice(2);
  console.log(await generateWideFile(path, Number(burns)));
}
