// Long layout: a row per element value. The fixture needs a profile (preamble, tab, own header
// names, local times); a second case shows the long layout recognised without one.
// Unit relations: NIST SP 811 §7.10 (1 mg/kg = 0.0001 %, 1 µg/kg = 0.0000001 %).
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CreateImportProfileRequestSchema } from '../../../server/domain/imports/import-profiles.schemas.ts';
import { parseResultFile } from '../../../server/domain/imports/parse/index.ts';

const fixtures = resolve(import.meta.dirname, '../../fixtures/imports');
const profile = CreateImportProfileRequestSchema.parse(JSON.parse(readFileSync(resolve(fixtures, 'quirks-long.profile.json'), 'utf8')));

describe('long layout', () => {
  it('reads the long fixture with a profile: burns split where an element repeats and the time changes', () => {
    const parsed = parseResultFile(readFileSync(resolve(fixtures, 'quirks-long.csv')), { profile });
    expect(parsed).toEqual({
      encoding: 'utf-8',
      bom: false,
      delimiter: '\t',
      decimal_separator: '.',
      layout: 'long',
      header_row: 3,
      header: ['Specimen Ref', 'Cast', 'Shift', 'Analysed', 'Analyte', 'Reading', 'Unit'],
      columns: [
        { index: 0, header: 'Specimen Ref', source: 'profile', role: 'sample_code' },
        { index: 1, header: 'Cast', source: 'profile', role: 'heat' },
        { index: 2, header: 'Shift', source: 'profile', role: 'field', field: 'shift' },
        { index: 3, header: 'Analysed', source: 'profile', role: 'measured_at' },
        { index: 4, header: 'Analyte', source: 'profile', role: 'element_name' },
        { index: 5, header: 'Reading', source: 'profile', role: 'value', unit: 'ppm', unit_source: 'profile' },
        { index: 6, header: 'Unit', source: 'profile', role: 'unit' },
      ],
      samples: [
        {
          sample_code: 'K24-0412-P1',
          heat: 'K24-0412',
          fields: { shift: 'B' },
          first_line: 4,
          rejected: [],
          burns: [
            {
              line: 4,
              burn_number: 1,
              measured_at: '2024-03-04T05:00:00.000Z',
              values: {
                C: { value: '0.452', qualifier: null, raw: '0.452', unit: '%' },
                Mn: { value: '0.75', qualifier: null, raw: '0.75', unit: '%' },
                Cr: { value: '0.125', qualifier: null, raw: '1250', unit: 'ppm' },
                B: { value: '0.0000005', qualifier: '<', raw: '<5', unit: 'ppb' },
              },
            },
            {
              line: 8,
              burn_number: 2,
              measured_at: '2024-03-04T05:00:40.000Z',
              values: {
                C: { value: '0.448', qualifier: null, raw: '0.448', unit: '%' },
                Mn: { value: null, qualifier: 'nd', raw: 'n.d.', unit: '%' },
              },
            },
          ],
        },
        {
          sample_code: 'K24-0413-L1',
          heat: 'K24-0413',
          fields: { shift: 'C' },
          first_line: 11,
          rejected: [],
          burns: [
            {
              line: 11,
              burn_number: 1,
              measured_at: '2024-03-04T07:45:10.000Z',
              values: { Si: { value: '0.25', qualifier: null, raw: '2500', unit: 'ppm' } },
            },
          ],
        },
      ],
      warnings: [],
      time_zone: '+01:00',
      naive_time_lines: [],
      rejected: [],
      counts: { rows: 8, burns: 3, values: 7 },
    });
  });

  it('is recognised without a profile from "Element" and "Value" headers, burns taken from the burn column', () => {
    const text = [
      'Sample;Burn;Element;Value;Unit',
      'S1;1;C;0,45;%',
      'S1;2;C;0,46;%',
      'S1;1;Mn;7500;ppm',
      'S1;2;mn;7600;mg/kg',
      'S1;2;Fe;;%',
    ].join('\n');
    const parsed = parseResultFile(Buffer.from(text));
    expect(parsed.layout).toBe('long');
    expect(parsed.decimal_separator).toBe(',');
    expect(parsed.samples).toHaveLength(1);
    expect(parsed.samples[0].burns).toEqual([
      {
        line: 2,
        burn_number: 1,
        values: {
          C: { value: '0.45', qualifier: null, raw: '0,45', unit: '%' },
          Mn: { value: '0.75', qualifier: null, raw: '7500', unit: 'ppm' },
        },
      },
      {
        line: 3,
        burn_number: 2,
        values: {
          C: { value: '0.46', qualifier: null, raw: '0,46', unit: '%' },
          Mn: { value: '0.76', qualifier: null, raw: '7600', unit: 'ppm' },
        },
      },
    ]);
    expect(parsed.counts).toEqual({ rows: 5, burns: 2, values: 4 });
  });

  it('with a long profile, a header that looks like an element is an identification field', () => {
    const longProfile = CreateImportProfileRequestSchema.parse({
      name: 'long',
      layout: 'long',
      long_columns: { element: 'Element', value: 'Value' },
    });
    const parsed = parseResultFile(Buffer.from('Sample,Element,Value,Ni\nS1,C,0.4,x\n'), { profile: longProfile });
    expect(parsed.layout).toBe('long');
    expect(parsed.columns[3]).toMatchObject({ header: 'Ni', role: 'field', field: 'Ni' });
    expect(parsed.samples[0].fields).toEqual({ Ni: 'x' });
  });

  it('without a profile, element headers make the file wide even when "Element" and "Value" columns exist', () => {
    const parsed = parseResultFile(Buffer.from('Sample,Element,Value,Ni\nS1,C,0.4,0.5\n'));
    expect(parsed.layout).toBe('wide');
    expect(parsed.columns.map((c) => c.role)).toEqual(['sample_code', 'field', 'field', 'element']);
  });
});
