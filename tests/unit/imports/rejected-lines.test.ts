// One test per kind of rejected line: each names the line (1-based, header = line 1) and the
// column, and the line's burn is left out while the other lines are read.
import { describe, expect, it } from 'vitest';
import { CreateImportProfileRequestSchema } from '../../../server/domain/imports/import-profiles.schemas.ts';
import { parseResultFile } from '../../../server/domain/imports/parse/index.ts';

const parse = (lines: string[], profile?: Record<string, unknown>) =>
  parseResultFile(
    Buffer.from(lines.join('\n')),
    profile ? { profile: CreateImportProfileRequestSchema.parse({ name: 'p', ...profile }) } : {},
  );

const burnLines = (parsed: ReturnType<typeof parse>) => parsed.samples.flatMap((s) => s.burns.map((b) => b.line));

describe('rejected lines (wide layout)', () => {
  it.each([
    ['0.7.5', 'is not a number'],
    ['abc', 'is not a number'],
    ['-0.01', 'negative'],
    ['"0,75"', 'is not a number'], // quoted: a decimal comma in a "." file
    ['<', 'is not a number'],
    ['100.5', 'above 100 %'],
    ['1e999999', 'above 100 %'],
  ])('a broken value "%s" names line and column (%s)', (cell, reason) => {
    const parsed = parse(['Sample,C,Mn %', 'S1,0.40,0.75', `S1,0.41,${cell}`, 'S1,0.42,0.77']);
    expect(parsed.rejected).toEqual([{ line: 3, column: 'Mn %', code: 'invalid_value', message: expect.stringContaining(reason) }]);
    expect(parsed.samples[0].rejected).toEqual(parsed.rejected);
    expect(burnLines(parsed)).toEqual([2, 4]);
    // The rejected row keeps its burn number: the next burn is still 3.
    expect(parsed.samples[0].burns.map((b) => b.burn_number)).toEqual([1, 3]);
  });

  it('reports every broken cell of one line', () => {
    const parsed = parse(['Sample,C,Mn', 'S1,x,y']);
    expect(parsed.rejected.map((i) => [i.line, i.column])).toEqual([
      [2, 'C'],
      [2, 'Mn'],
    ]);
    expect(parsed.samples).toEqual([]);
  });

  it('a row with too few cells, or extra cells holding something, is rejected naming the line', () => {
    const parsed = parse(['Sample,C,Mn', 'S1,0.4', 'S1,0.4,0.7,oops', 'S1,0.4,0.7,,', 'S1,0.4,0.7']);
    expect(parsed.rejected).toEqual([
      { line: 2, code: 'column_count', message: 'Line 2 has 2 cells where the header has 3.' },
      { line: 3, code: 'column_count', message: 'Line 3 has 4 cells where the header has 3.' },
    ]);
    expect(burnLines(parsed)).toEqual([4, 5]);
  });

  it('a row without a sample code', () => {
    const parsed = parse(['Sample,C', ',0.4', 'S1,0.5']);
    expect(parsed.rejected).toEqual([{ line: 2, column: 'Sample', code: 'missing_sample_code', message: 'Line 2 has no sample code.' }]);
    expect(burnLines(parsed)).toEqual([3]);
  });

  it('a burn number that is not a positive whole number', () => {
    const parsed = parse(['Sample,Burn,C', 'S1,1,0.4', 'S1,two,0.5', 'S1,0,0.5']);
    expect(parsed.rejected.map((i) => [i.line, i.column, i.code])).toEqual([
      [3, 'Burn', 'invalid_burn_number'],
      [4, 'Burn', 'invalid_burn_number'],
    ]);
  });

  it('a burn number twice in one sample', () => {
    const parsed = parse(['Sample,Replicate,C', 'S1,1,0.4', 'S1,2,0.5', 'S1,2,0.6']);
    expect(parsed.rejected).toEqual([
      { line: 4, column: 'Replicate', code: 'duplicate_burn', message: 'Burn 2 of sample S1 appears twice (lines 3 and 4).' },
    ]);
    expect(parsed.samples[0].burns.map((b) => b.values.C.value)).toEqual(['0.4', '0.5']);
  });

  it('a time that cannot be read, or does not exist', () => {
    const parsed = parse(['Sample,Time,C', 'S1,yesterday,0.4', 'S1,2024-02-30 10:00,0.4', 'S1,2024-02-29 10:00,0.4']);
    expect(parsed.rejected.map((i) => [i.line, i.column, i.code])).toEqual([
      [2, 'Time', 'invalid_time'],
      [3, 'Time', 'invalid_time'],
    ]);
    expect(parsed.samples[0].burns[0].measured_at).toBe('2024-02-29T10:00:00.000Z');
  });

  it('a time in another format than the profile names', () => {
    const parsed = parse(['Sample,Time,C', 'S1,2024-03-04 10:00,0.4', 'S1,04.03.2024 10:00,0.4'], {
      time: { format: 'DD.MM.YYYY HH:mm[:ss]', utc_offset: 'Z' },
    });
    expect(parsed.rejected).toEqual([
      {
        line: 2,
        column: 'Time',
        code: 'invalid_time',
        message: '"2024-03-04 10:00" on line 2 is not a valid time (DD.MM.YYYY HH:mm[:ss]).',
      },
    ]);
  });

  it('physical line numbers survive blank lines and line breaks inside quoted cells', () => {
    const parsed = parse(['Sample,Note,C', 'S1,"two', 'lines",0.4', '', 'S1,x,bad']);
    expect(parsed.samples[0].burns[0].line).toBe(2);
    expect(parsed.rejected[0]).toMatchObject({ line: 5, column: 'C' });
  });
});

describe('preamble', () => {
  it("lines above the profile's header row are skipped, even with a quote that never closes", () => {
    const parsed = parse(['"Export of OES-1', 'operator: A. Moss', 'Sample,C', 'S1,0.4', 'S1,x'], { header_row: 3 });
    expect(parsed.samples[0].burns.map((b) => b.line)).toEqual([4]);
    expect(parsed.rejected[0]).toMatchObject({ line: 5, column: 'C' });
  });
});

describe('rejected lines (long layout)', () => {
  const long = { layout: 'long', long_columns: { element: 'Element', value: 'Value', unit: 'Unit' } };

  it.each([
    ['Xx;0.4;%', 'Element', 'unknown_element'],
    [';0.4;%', 'Element', 'missing_element'],
    ['C;0.4;mol%', 'Unit', 'unknown_unit'],
    ['C;0.4.1;%', 'Value', 'invalid_value'],
  ])('"%s" → %s: %s', (row, column, code) => {
    const parsed = parse(['Sample;Element;Value;Unit', 'S1;Mn;0.7;%', `S1;${row}`], long);
    expect(parsed.rejected).toEqual([{ line: 3, column, code, message: expect.any(String) }]);
    expect(parsed.samples[0].burns[0].values).toHaveProperty('Mn');
  });

  it('the same element twice in one numbered burn', () => {
    const parsed = parse(['Sample;Burn;Element;Value', 'S1;1;C;0.4', 'S1;1;c;0.5'], {
      layout: 'long',
      long_columns: { element: 'Element', value: 'Value' },
    });
    expect(parsed.rejected).toEqual([
      { line: 3, column: 'Element', code: 'duplicate_value', message: 'Burn 1 of sample S1 has C twice (line 3).' },
    ]);
  });
});

describe('warnings (the line is still read)', () => {
  it('a sample that comes back after others is read as a separate sample', () => {
    const parsed = parse(['Sample,Heat,C', 'S1,K1,0.4', 'S2,K1,0.5', 'S1,K1,0.6']);
    expect(parsed.samples.map((s) => [s.sample_code, s.first_line])).toEqual([
      ['S1', 2],
      ['S2', 3],
      ['S1', 4],
    ]);
    expect(parsed.warnings).toEqual([{ line: 4, code: 'sample_repeated', message: expect.stringContaining('first on line 2') }]);
  });

  it('a grade that changes within a sample keeps the first and warns naming the column', () => {
    const parsed = parse(['Sample,Alloy,C', 'S1,6061,0.4', 'S1,6063,0.5']);
    expect(parsed.samples[0].grade).toBe('6061');
    expect(parsed.warnings).toEqual([{ line: 3, column: 'Alloy', code: 'identification_changed', message: expect.any(String) }]);
  });

  it('a row without any element value is skipped with a warning', () => {
    const parsed = parse(['Sample,C,Mn', 'S1,,', 'S1,0.4,']);
    expect(parsed.warnings).toEqual([{ line: 2, code: 'empty_burn', message: 'Line 2 holds no element values; it is skipped.' }]);
    expect(parsed.samples[0].burns).toEqual([
      { line: 3, burn_number: 2, values: { C: { value: '0.4', qualifier: null, raw: '0.4', unit: '%' } } },
    ]);
  });

  it('a short header that is no element symbol becomes a field with a warning', () => {
    const parsed = parse(['Sample,Xx,C', 'S1,abc,0.4']);
    expect(parsed.warnings).toEqual([{ line: 1, column: 'Xx', code: 'unrecognised_header', message: expect.any(String) }]);
    expect(parsed.samples[0].fields).toEqual({ Xx: 'abc' });
  });
});
