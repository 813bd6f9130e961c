// Property: randomly damaged CSV text either parses or throws FileLayoutError — never another
// exception — and what it returns is sound: values are plain decimal strings in % (never NaN,
// never exponent notation, never above 100), lines point into the file, counts add up.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CreateImportProfileRequestSchema } from '../../../server/domain/imports/import-profiles.schemas.ts';
import { FileLayoutError, type ParsedFile, parseResultFile } from '../../../server/domain/imports/parse/index.ts';
import { wideCsv } from '../../../bench/generate-wide-file.ts';

const fixtures = resolve(import.meta.dirname, '../../fixtures/imports');
const BASES = [
  readFileSync(resolve(fixtures, 'quirks-wide.utf8-bom.csv'), 'utf8'),
  readFileSync(resolve(fixtures, 'quirks-long.csv'), 'utf8').split('\n').slice(2).join('\n'),
  wideCsv(12, { delimiter: ';' }),
  'Sample,Burn,Time,C,Mn [ppm],Cu mg/kg\nS1,1,2024-03-04T06:00:00Z,0.40,<5,n.d.\nS1,2,2024-03-04T06:00:40Z,0.41,6,12\n',
];
const PROFILES = [
  undefined,
  CreateImportProfileRequestSchema.parse({
    name: 'long',
    layout: 'long',
    delimiter: 'tab',
    long_columns: { element: 'Analyte', value: 'Reading', unit: 'Unit' },
    columns: { sample_code: 'Specimen Ref' },
  }),
  CreateImportProfileRequestSchema.parse({
    name: 'strict',
    delimiter: ';',
    decimal_separator: ',',
    encoding: 'utf-8',
    default_unit: 'ppm',
    time: { format: 'iso8601', utc_offset: '+01:00' },
  }),
];
const PIECES = [
  ';',
  ',',
  '\t',
  '"',
  '\n',
  '\r\n',
  '\r',
  '<',
  '>',
  '.',
  '-',
  'e',
  'E9',
  '1e-40',
  '0',
  '7',
  '99999',
  'a',
  'µ',
  '\ufeff',
  ' ',
  '%',
  '[',
  ']',
  '(',
  ')',
  'n.d.',
  'Xx %',
  'Mn',
  '\u0000',
  '€',
];

type Mutation = (text: string) => string;
const at = (text: string, fraction: number) => Math.floor(fraction * (text.length + 1));
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(...PIECES)).map(
    ([f, piece]) =>
      (t: string) =>
        t.slice(0, at(t, f)) + piece + t.slice(at(t, f)),
  ),
  fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: 1, max: 12 })).map(
    ([f, n]) =>
      (t: string) =>
        t.slice(0, at(t, f)) + t.slice(at(t, f) + n),
  ),
  fc.double({ min: 0, max: 1, noNaN: true }).map((f) => (t: string) => t.slice(0, at(t, f))),
  fc.constantFrom<Mutation>(
    (t) => t.replaceAll(';', '\u0001').replaceAll(',', ';').replaceAll('\u0001', ','),
    (t) => t.replaceAll(';', '\t'),
    (t) => t.replaceAll('.', ','),
  ),
  fc.tuple(fc.nat(), fc.nat()).map(([a, b]) => (t: string) => {
    const lines = t.split('\n');
    const [i, j] = [a % lines.length, b % lines.length];
    [lines[i], lines[j]] = [lines[j], lines[i]];
    return lines.join('\n');
  }),
);
const encode = fc.constantFrom<(t: string) => Buffer>(
  (t) => Buffer.from(t, 'utf8'),
  (t) => Buffer.from(t, 'latin1'),
  (t) => Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(t, 'utf8')]),
);

const PLAIN_DECIMAL = /^\d+(\.\d+)?$/;

function checkSound(parsed: ParsedFile, bytes: Buffer): void {
  const lineCount = bytes.toString('latin1').split(/\r\n|\r|\n/).length;
  const lineOk = (line: number | undefined) => line === undefined || (Number.isInteger(line) && line >= 1 && line <= lineCount);
  let burns = 0;
  let values = 0;
  for (const sample of parsed.samples) {
    expect(sample.sample_code.trim()).not.toBe('');
    expect(sample.burns.length).toBeGreaterThan(0);
    expect(new Set(sample.burns.map((b) => b.burn_number)).size).toBe(sample.burns.length);
    for (const issue of sample.rejected) expect(parsed.rejected).toContain(issue);
    for (const burn of sample.burns) {
      burns += 1;
      expect(Number.isInteger(burn.burn_number) && burn.burn_number >= 1).toBe(true);
      expect(lineOk(burn.line)).toBe(true);
      if (burn.measured_at !== undefined) expect(new Date(burn.measured_at).toISOString()).toBe(burn.measured_at);
      for (const [element, cell] of Object.entries(burn.values)) {
        values += 1;
        expect(element).toMatch(/^[A-Z][a-z]?$/);
        expect([null, '<', '>', 'nd']).toContain(cell.qualifier);
        if (cell.qualifier === 'nd') expect(cell.value).toBeNull();
        else {
          expect(cell.value).toMatch(PLAIN_DECIMAL);
          expect(Number(cell.value)).toBeLessThanOrEqual(100);
        }
      }
    }
  }
  expect(parsed.counts.burns).toBe(burns);
  expect(parsed.counts.values).toBe(values);
  for (const issue of [...parsed.rejected, ...parsed.warnings]) {
    expect(lineOk(issue.line)).toBe(true);
    expect(typeof issue.code).toBe('string');
    expect(issue.message).not.toMatch(/NaN|undefined/);
  }
}

describe('randomly mutated result files', () => {
  it('parse soundly or throw FileLayoutError, nothing else', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...BASES),
        fc.array(mutation, { maxLength: 8 }),
        encode,
        fc.constantFrom(...PROFILES),
        (base, mutations, toBytes, profile) => {
          const bytes = toBytes(mutations.reduce((text, mutate) => mutate(text), base));
          let parsed: ParsedFile;
          try {
            parsed = parseResultFile(bytes, { profile });
          } catch (error) {
            expect(error).toBeInstanceOf(FileLayoutError);
            const issues = (error as FileLayoutError).issues;
            expect(issues.length).toBeGreaterThan(0);
            for (const issue of issues) expect(issue.message).not.toMatch(/NaN|undefined/);
            return;
          }
          checkSound(parsed, bytes);
        },
      ),
      { numRuns: 1500 },
    );
  });
});
