// Whole-file problems throw FileLayoutError with issues naming the line and, where there is
// one, the column. The caller answers 422 and imports nothing.
import { describe, expect, it } from 'vitest';
import { CreateImportProfileRequestSchema } from '../../../server/domain/imports/import-profiles.schemas.ts';
import { FileLayoutError, parseResultFile } from '../../../server/domain/imports/parse/index.ts';
import type { Issue } from '../../../server/domain/imports/parse/types.ts';

function layoutIssues(bytes: Buffer, profile?: Record<string, unknown>): Issue[] {
  try {
    parseResultFile(bytes, profile ? { profile: CreateImportProfileRequestSchema.parse({ name: 'p', ...profile }) } : {});
  } catch (error) {
    if (error instanceof FileLayoutError) return error.issues;
    throw error;
  }
  throw new Error('expected a FileLayoutError');
}

const text = (...lines: string[]) => Buffer.from(lines.join('\n'));

describe('FileLayoutError', () => {
  it('an empty or blank file', () => {
    expect(layoutIssues(Buffer.alloc(0))).toEqual([{ code: 'empty_file', message: 'The file is empty.' }]);
    expect(layoutIssues(text('', '  ', ''))[0].code).toBe('empty_file');
    expect(layoutIssues(Buffer.from([0xef, 0xbb, 0xbf]))[0].code).toBe('empty_file');
  });

  it('a header and no data lines', () => {
    expect(layoutIssues(text('Sample,C', ',', ''))).toEqual([
      { line: 1, code: 'no_rows', message: 'The file has a header on line 1 but no data lines.' },
    ]);
  });

  it("the profile's header row is blank or past the end", () => {
    expect(layoutIssues(text('x', '', 'Sample,C', 'S1,0.4'), { header_row: 2 })).toEqual([
      { line: 2, code: 'no_header', message: expect.stringContaining('blank') },
    ]);
    expect(layoutIssues(text('Sample,C'), { header_row: 9 })[0]).toMatchObject({ line: 9, code: 'no_header' });
  });

  it('a header that is one column', () => {
    expect(layoutIssues(text('Sample C', 'S1 0.4'))[0]).toMatchObject({ line: 1, code: 'no_delimiter' });
  });

  it('no sample-code column', () => {
    expect(layoutIssues(text('Heat,C', 'K1,0.4'))).toEqual([
      { line: 1, code: 'no_sample_code_column', message: expect.stringContaining('sample code') },
    ]);
  });

  it('no element column', () => {
    expect(layoutIssues(text('Sample,Heat,Furnace', 'S1,K1,EAF-1'))).toEqual([
      { line: 1, code: 'no_element_columns', message: expect.any(String) },
    ]);
  });

  it('an element header whose symbol is no element rejects the file, naming the column', () => {
    expect(layoutIssues(text('Sample,C %,Xx %,Qq [ppm]', 'S1,0.4,1,2'))).toEqual([
      {
        line: 1,
        column: 'Xx %',
        code: 'unknown_element_header',
        message: 'The column "Xx %" carries a unit but "Xx" is not an element symbol.',
      },
      {
        line: 1,
        column: 'Qq [ppm]',
        code: 'unknown_element_header',
        message: 'The column "Qq [ppm]" carries a unit but "Qq" is not an element symbol.',
      },
    ]);
  });

  it('an element header with a unit that is not a mass fraction', () => {
    expect(layoutIssues(text('Sample,Mn [mol%]', 'S1,0.4'))).toEqual([
      { line: 1, column: 'Mn [mol%]', code: 'unknown_unit_header', message: expect.stringContaining('"mol%"') },
    ]);
  });

  it('two columns holding the same element', () => {
    expect(layoutIssues(text('Sample,C,c [ppm]', 'S1,0.4,4000'))).toEqual([
      { line: 1, column: 'c [ppm]', code: 'duplicate_element_column', message: expect.any(String) },
    ]);
  });

  it('a column the profile names is missing', () => {
    expect(layoutIssues(text('Sample,C', 'S1,0.4'), { columns: { heat: 'Heat No' } })).toEqual([
      {
        line: 1,
        column: 'Heat No',
        code: 'missing_column',
        message: 'The profile reads "Heat No" as columns.heat, but the header on line 1 has no such column.',
      },
    ]);
  });

  it('bytes that are not UTF-8 when the profile says UTF-8, or after a UTF-8 BOM', () => {
    const latin = Buffer.concat([Buffer.from('Sample,Al ppb\nS1,'), Buffer.from([0xb5]), Buffer.from('5\n')]);
    expect(layoutIssues(latin, { encoding: 'utf-8' })).toEqual([
      { line: 2, code: 'undecodable', message: 'Line 2 holds bytes that are not valid UTF-8.' },
    ]);
    expect(layoutIssues(Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), latin]))[0]).toMatchObject({ line: 2, code: 'undecodable' });
  });

  it('UTF-16 and binary files', () => {
    expect(layoutIssues(Buffer.from('\ufeffSample,C\n', 'utf16le'))[0].code).toBe('unsupported_encoding');
    expect(layoutIssues(Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00]))[0].code).toBe('binary_file');
  });

  it('a quote that is never closed names the line its record starts on', () => {
    expect(layoutIssues(text('Sample,C', 'S1,0.4', '"S2,0.5', 'S3,0.6'))).toEqual([
      { line: 3, code: 'malformed_csv', message: 'A quote (") opened in the record starting on line 3 is never closed.' },
    ]);
  });
});
