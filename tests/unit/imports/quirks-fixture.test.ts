// One wide file with every quirk at once, saved twice: UTF-8 with BOM and Windows-1252 (a BOM
// and a Windows-1252 "µ" cannot share one file). Both must give exactly this result.
// Unit relations (NIST SP 811 §7.10; SI brochure): 1 mg/kg = 0.0001 %, 1 µg/kg = 0.0000001 %,
// mass fraction 0.01 = 1 %.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseResultFile } from '../../../server/domain/imports/parse/index.ts';
import type { ParsedValue } from '../../../server/domain/imports/parse/types.ts';

const fixture = (name: string) => readFileSync(resolve(import.meta.dirname, '../../fixtures/imports', name));

function v(value: string | null, raw: string, unit: ParsedValue['unit'] = '%', qualifier: ParsedValue['qualifier'] = null): ParsedValue {
  return { value, qualifier, raw, unit };
}

const HEADER = [
  'No',
  'Sample ID',
  'Heat No.',
  'Grade',
  'Sample type',
  'Furnace',
  'Burn',
  'Date/Time',
  'C %',
  'si [%]',
  'MN(%)',
  'P',
  's wt%',
  'Cr [ppm]',
  'Ni mg/kg',
  'Cu(ppb)',
  'Al µg/kg',
  'B mass fraction',
  '%Mo',
];

const el = (index: number, element: string, unit: string, unit_source = 'header') => ({
  index,
  header: HEADER[index],
  source: 'auto',
  role: 'element',
  element,
  unit,
  unit_source,
});

const EXPECTED = {
  delimiter: ';',
  decimal_separator: ',',
  layout: 'wide',
  header_row: 1,
  header: HEADER,
  columns: [
    { index: 0, header: 'No', source: 'auto', role: 'ignored' },
    { index: 1, header: 'Sample ID', source: 'auto', role: 'sample_code' },
    { index: 2, header: 'Heat No.', source: 'auto', role: 'heat' },
    { index: 3, header: 'Grade', source: 'auto', role: 'grade' },
    { index: 4, header: 'Sample type', source: 'auto', role: 'kind' },
    { index: 5, header: 'Furnace', source: 'auto', role: 'field', field: 'Furnace' },
    { index: 6, header: 'Burn', source: 'auto', role: 'burn_number' },
    { index: 7, header: 'Date/Time', source: 'auto', role: 'measured_at' },
    el(8, 'C', '%'),
    el(9, 'Si', '%'),
    el(10, 'Mn', '%'),
    el(11, 'P', '%', 'default'),
    el(12, 'S', '%'),
    el(13, 'Cr', 'ppm'),
    el(14, 'Ni', 'ppm'),
    el(15, 'Cu', 'ppb'),
    el(16, 'Al', 'ppb'),
    el(17, 'B', 'fraction'),
    el(18, 'Mo', '%'),
  ],
  samples: [
    {
      sample_code: 'K24-0412-P1',
      heat: 'K24-0412',
      grade: 'SAE 1045',
      kind: 'preliminary',
      fields: { Furnace: 'EAF-2' },
      first_line: 2,
      rejected: [],
      burns: [
        {
          line: 2,
          burn_number: 1,
          measured_at: '2024-03-04T06:00:00.000Z',
          values: {
            C: v('0.452', '0,452'),
            Si: v('0.21', '0,21'),
            Mn: v('0.75', '0,75'),
            P: v('0.012', '0,012'),
            S: v('0.005', '<0,005', '%', '<'),
            Cr: v('0.125', '1250', 'ppm'),
            Ni: v('0.03', '300', 'ppm'),
            Cu: v('0.00015', '1500', 'ppb'),
            Al: v('0.000025', '250', 'ppb'),
            B: v('0.00025', '0,0000025', 'fraction'),
            Mo: v('0.02', '0,020'),
          },
        },
        {
          line: 3,
          burn_number: 2,
          measured_at: '2024-03-04T06:00:40.000Z',
          values: {
            C: v('0.448', '0,448'),
            Si: v('0.22', '0,22'),
            Mn: v('0.76', '0,76'),
            P: v('0.011', '0,011'),
            S: v('0.005', '<0,005', '%', '<'),
            Cr: v('0.124', '1240', 'ppm'),
            Cu: v('0.000148', '1480', 'ppb'),
            Al: v(null, 'n.d.', 'ppb', 'nd'),
            B: v('0.00024', '0,0000024', 'fraction'),
            Mo: v('0.021', '0,021'),
          },
        },
        {
          line: 4,
          burn_number: 3, // blank burn cell: counted on within the sample
          measured_at: '2024-03-04T06:01:20.000Z', // 07:01:20+01:00
          values: {
            C: v('0.45', '0,450'),
            Si: v('0.21', '0,21'),
            Mn: v('1.5', '>1,5', '%', '>'),
            P: v('0.012', '0,012'),
            S: v('0.004', '0,004'),
            Cr: v('0.126', '1260', 'ppm'),
            Ni: v('0.031', '310', 'ppm'),
            Cu: v('0.000151', '1510', 'ppb'),
            Al: v(null, 'N.D.', 'ppb', 'nd'),
            B: v('0.00026', '0,0000026', 'fraction'),
            Mo: v('0.02', '0,020'),
          },
        },
      ],
    },
    {
      sample_code: 'K24-0412-F1',
      heat: 'K24-0412',
      grade: 'SAE 1045',
      kind: 'final',
      fields: { Furnace: 'EAF-2' },
      first_line: 6,
      rejected: [],
      burns: [
        {
          line: 6,
          burn_number: 1,
          measured_at: '2024-03-04T06:20:00.000Z',
          values: {
            C: v('0.47', '0,47'),
            Si: v('0.23', '0,23'),
            Mn: v('0.8', '0,80'),
            P: v('0.01', '0,010'),
            S: v('0.006', '0,006'),
            Cr: v('0.13', '1300', 'ppm'),
            Ni: v('0.032', '320', 'ppm'),
            Cu: v('0.00016', '1600', 'ppb'),
            Al: v('0.000026', '260', 'ppb'),
            B: v('0.0003', '0,0000030', 'fraction'),
            Mo: v('0.022', '0,022'),
          },
        },
        {
          line: 7,
          burn_number: 2,
          measured_at: '2024-03-04T06:20:45.000Z',
          values: {
            C: v('0.46', '0,46'),
            Si: v('0.23', '0,23'),
            Mn: v('0.81', '0,81'),
            P: v('0.01', '0,010'),
            S: v('0.006', '0,006'),
            Cr: v('0.131', '1310', 'ppm'),
            Ni: v('0.032', '320', 'ppm'),
            Cu: v('0.000159', '1590', 'ppb'),
            Al: v('0.000027', '270', 'ppb'),
            B: v('0.00031', '0,0000031', 'fraction'),
            Mo: v('0.022', '0,022'),
          },
        },
      ],
    },
    {
      sample_code: 'K24-0413;L1', // quoted cell holding the delimiter
      heat: 'K24-0413',
      grade: 'SAE 1018',
      kind: 'ladle',
      fields: { Furnace: 'EAF-1' },
      first_line: 8,
      rejected: [],
      burns: [
        {
          line: 8,
          burn_number: 1,
          measured_at: '2024-03-04T07:45:10.000Z',
          values: {
            C: v('0.17', '0,17'),
            Si: v('0.25', '0,25'),
            Mn: v('0.72', '0,72'),
            P: v('0.009', '0,009'),
            S: v('0.004', '0,004'),
            Cr: v('0.08', '800', 'ppm'),
          },
        },
      ],
    },
  ],
  warnings: [{ column: 'Date/Time', code: 'time_without_offset', message: expect.stringContaining('read as UTC') }],
  rejected: [],
  counts: { rows: 6, burns: 6, values: 60 },
  // No profile: times without an offset are read as UTC; line 4 carries its own (+01:00).
  time_zone: 'UTC',
  naive_time_lines: [2, 3, 6, 7, 8],
};

describe('the every-quirk wide fixture', () => {
  it('UTF-8 with BOM, CRLF, ";" and decimal comma: exactly the expected samples', () => {
    expect(parseResultFile(fixture('quirks-wide.utf8-bom.csv'))).toEqual({ encoding: 'utf-8', bom: true, ...EXPECTED });
  });

  it('the same file in Windows-1252 (µ as byte 0xB5) gives the same result', () => {
    expect(parseResultFile(fixture('quirks-wide.windows-1252.csv'))).toEqual({ encoding: 'windows-1252', bom: false, ...EXPECTED });
  });
});
