// Multipart bodies for the upload operations: the form fields of the operation's schema, extra
// hostile fields, and a result file — a well-formed wide file (sometimes with one odd cell or
// column), a file of hostile headers and cells, or random bytes — or broken multipart outright.
import fc from 'fast-check';
import { asText, brokenBody, rarely } from './broken-bodies.ts';
import type { FuzzBody } from './fuzz-requests.ts';
import { hostileKey, hostileString, PROTOTYPE_NAMES } from './hostile.ts';
import { arbitraryFor, resolve, type JsonSchema, type Vocabulary } from './schema-arbitrary.ts';

const CSV_HEADERS = [
  'Sample',
  'Sample ID',
  'Heat',
  'Grade',
  'Kind',
  'Burn',
  'Time',
  'Mn %',
  'C',
  'Si [ppm]',
  'Ni mg/kg',
  'Element',
  'Value',
  'Unit',
  'No',
  '#',
];
const CSV_ODD_HEADERS = ['Mn constructor', 'Mn __proto__', 'C tostring', 'Xx %', 'Fe (calc)', 'Mn', 'MN'];
const CSV_CELLS = [
  'K24-0001',
  'K24-0001',
  '0.75',
  '<0.001',
  '>2',
  'n.d.',
  '1e308',
  '-0',
  'NaN',
  '0,75',
  '',
  'final',
  'ppm',
  'Mn',
  '2026-01-02 10:00',
  '1',
];

/** A file of hostile headers and cells. */
const oddCsv = fc
  .tuple(
    fc.array(
      fc.oneof(fc.constantFrom(...CSV_HEADERS), fc.constantFrom(...CSV_ODD_HEADERS, ...PROTOTYPE_NAMES), fc.string({ maxLength: 8 })),
      {
        minLength: 1,
        maxLength: 6,
      },
    ),
    fc.array(
      fc.array(
        fc.oneof(
          fc.constantFrom(...CSV_CELLS, ...PROTOTYPE_NAMES),
          hostileString.map((s) => s.slice(0, 50)),
        ),
        { maxLength: 7 },
      ),
      {
        maxLength: 5,
      },
    ),
    fc.constantFrom(',', ';', '\t'),
    fc.boolean(),
  )
  .map(([header, rows, delimiter, sampleFirst]) =>
    [sampleFirst ? ['Sample', ...header] : header, ...rows].map((cells) => cells.join(delimiter)),
  );

/** A well-formed wide file (sample, heat, burn, element columns), sometimes with one odd cell or column. */
const wideCsv = fc
  .tuple(
    fc.uniqueArray(fc.constantFrom('C', 'Mn', 'Si', 'Cr', 'Ni', 'Mo', 'Cu', 'S', 'P'), { minLength: 1, maxLength: 5 }),
    fc.constantFrom('', ' %', ' [ppm]'),
    fc.integer({ min: 1, max: 4 }),
    fc.option(fc.oneof(fc.constantFrom(...PROTOTYPE_NAMES, ...CSV_ODD_HEADERS), fc.string({ maxLength: 8 })), { freq: 3 }),
    fc.array(
      fc.oneof(
        { weight: 12, arbitrary: fc.integer({ min: 0, max: 30_000 }).map((n) => String(n / 10_000)) },
        fc.constantFrom(...CSV_CELLS),
      ),
      { minLength: 40, maxLength: 40 },
    ),
  )
  .map(([elements, unit, samples, extra, cells]) => {
    const header = ['Sample', 'Heat', 'Burn', ...(extra === null ? [] : [extra]), ...elements.map((e) => `${e}${unit}`)];
    const rows = Array.from({ length: samples * 2 }, (_, i) => {
      const values = elements.map((_e, j) => (cells[(i * 7 + j) % 40] === '' ? '0.5' : String(cells[(i * 7 + j) % 40])));
      return [`FZ-${Math.floor(i / 2)}`, `H-${Math.floor(i / 2)}`, String((i % 2) + 1), ...(extra === null ? [] : [`x${i}`]), ...values];
    });
    return [header, ...rows].map((row) => row.join(','));
  });

const csvFile: fc.Arbitrary<Buffer> = fc.oneof(wideCsv, oddCsv).map((lines) => Buffer.from(`${lines.join('\n')}\n`));

export function multipartBody(schema: JsonSchema, vocabulary: Vocabulary): fc.Arbitrary<FuzzBody> {
  const resolved = resolve(schema, vocabulary);
  const properties = Object.entries(resolved.properties ?? {}).filter(([name]) => name !== 'file');
  // Required fields are left out one time in ten, optional ones half of the time.
  const field = ([name, s]: [string, JsonSchema]) =>
    fc.option(
      fc
        .oneof(
          { weight: 4, arbitrary: arbitraryFor(s, vocabulary, name).map(asText) },
          hostileString.map((v) => v.slice(0, 5000)),
        )
        .map((value): [string, string] => [name, value]),
      { freq: resolved.required?.includes(name) ? 10 : 2 },
    );
  const extra = rarely(
    fc.array(
      fc.oneof(
        fc.tuple(hostileKey, hostileString).map(([k, v]): [string, string] => [k || 'x', v.slice(0, 200)]),
        fc.constantFrom<[string, string]>(['file[buffer]', 'x'], ['instrument_id', 'twice'], ['__proto__[polluted]', '1']),
      ),
      { minLength: 1, maxLength: 2 },
    ),
  );
  const file = fc.option(
    fc.record({
      name: fc.oneof(fc.constantFrom('results.csv', '__proto__.csv', 'a'), fc.string({ minLength: 1, maxLength: 20 })),
      content: fc.oneof(
        { weight: 4, arbitrary: csvFile },
        fc.uint8Array({ maxLength: 200 }).map((b) => Buffer.from(b)),
      ),
    }),
    { freq: 8 },
  );
  const valid = fc.tuple(fc.tuple(...properties.map(field)), extra, file).map(([fields, extras, f]): FuzzBody => ({
    kind: 'multipart',
    fields: [...fields.filter((x): x is [string, string] => x !== null), ...extras],
    ...(f ? { file: f } : {}),
  }));
  return fc.oneof({ weight: 8, arbitrary: valid }, brokenBody);
}
