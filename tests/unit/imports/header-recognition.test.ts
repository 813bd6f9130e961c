// Header recognition: element headers in every unit form, identification aliases, and the
// documented alias table staying equal to the code.
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { AUTO_DETECTION_DESCRIPTION, CreateImportProfileRequestSchema } from '../../../server/domain/imports/import-profiles.schemas.ts';
import { parseElementHeader } from '../../../server/domain/imports/parse/element-header.ts';
import { aliasRole, HEADER_ALIASES } from '../../../server/domain/imports/parse/header-aliases.ts';
import { parseResultFile } from '../../../server/domain/imports/parse/index.ts';

describe('element headers', () => {
  it.each([
    ['Mn', { kind: 'element', element: 'Mn' }],
    ['MN', { kind: 'element', element: 'Mn' }],
    ['mn', { kind: 'element', element: 'Mn' }],
    ['Mn %', { kind: 'element', element: 'Mn', unit: '%' }],
    ['Mn%', { kind: 'element', element: 'Mn', unit: '%' }],
    ['%Mn', { kind: 'element', element: 'Mn', unit: '%' }],
    ['Mn [%]', { kind: 'element', element: 'Mn', unit: '%' }],
    ['C [ppm]', { kind: 'element', element: 'C', unit: 'ppm' }],
    ['Si(%)', { kind: 'element', element: 'Si', unit: '%' }],
    ['Cu mg/kg', { kind: 'element', element: 'Cu', unit: 'ppm' }],
    ['B µg/kg', { kind: 'element', element: 'B', unit: 'ppb' }],
    ['B μg/kg', { kind: 'element', element: 'B', unit: 'ppb' }], // Greek mu
    ['Pb ug/kg', { kind: 'element', element: 'Pb', unit: 'ppb' }],
    ['Al wt%', { kind: 'element', element: 'Al', unit: '%' }],
    ['Ni (mass fraction)', { kind: 'element', element: 'Ni', unit: 'fraction' }],
    [' Cr  [ PPM ] ', { kind: 'element', element: 'Cr', unit: 'ppm' }],
    ['Mn []', { kind: 'element', element: 'Mn' }],
    ['Xx %', { kind: 'unknown_element', symbol: 'Xx' }],
    ['Mn [mol%]', { kind: 'unknown_unit', element: 'Mn', unit: 'mol%' }],
    ['Xx', { kind: 'short_unknown' }],
    ['Fe base', { kind: 'not_element' }],
    ['Sum %', { kind: 'not_element' }],
    ['Furnace', { kind: 'not_element' }],
  ])('%s', (header, expected) => {
    expect(parseElementHeader(header)).toEqual(expected);
  });
});

describe('identification headers', () => {
  it.each([
    ['Sample', 'sample_code'],
    ['SAMPLE_CODE', 'sample_code'],
    ['Sample ID', 'sample_code'],
    ['sample-id', 'sample_code'],
    ['Heat', 'heat'],
    ['Heat No.', 'heat'],
    ['LOT', 'heat'],
    ['Grade', 'grade'],
    ['Burn', 'burn_number'],
    ['Replicate', 'burn_number'],
    ['Time', 'measured_at'],
    ['Timestamp', 'measured_at'],
    ['Date/Time', 'measured_at'],
    ['No', 'ignored'],
    ['#', 'ignored'],
    ['Furnace', undefined],
    ['Sample kind', 'kind'],
  ])('%s → %s', (header, role) => {
    expect(aliasRole(header)).toBe(role);
  });

  it('the OpenAPI description of import profiles names every alias', () => {
    for (const alias of Object.values(HEADER_ALIASES).flat()) expect(AUTO_DETECTION_DESCRIPTION).toContain(`\`${alias}\``);
  });

  it('docs/imports/auto-detection.md lists exactly the aliases the code recognises', () => {
    const doc = readFileSync(resolve(import.meta.dirname, '../../../docs/imports/auto-detection.md'), 'utf8');
    const section = doc.split('## Identification headers')[1].split('\n## ')[0];
    const rows = [...section.matchAll(/^\| `(\w+)` \| (.+?) \|/gm)].map(([, role, aliases]) => [
      role,
      [...aliases.matchAll(/`([^`]+)`/g)].map((m) => m[1]),
    ]);
    expect(Object.fromEntries(rows)).toEqual(HEADER_ALIASES);
  });
});

describe('profile header names', () => {
  it('match ignoring case and surrounding or repeated spaces, and win over recognition', () => {
    const profile = CreateImportProfileRequestSchema.parse({
      name: 'p',
      columns: { sample_code: '  heat   NO ', heat: 'Sample' },
      ignore_columns: ['c'],
    });
    const parsed = parseResultFile(Buffer.from('Sample,Heat No,C,Mn\nK24-0412,S1,0.4,0.7\n'), { profile });
    expect(parsed.columns.map((c) => [c.header, c.role, c.source])).toEqual([
      ['Sample', 'heat', 'profile'],
      ['Heat No', 'sample_code', 'profile'],
      ['C', 'ignored', 'profile'],
      ['Mn', 'element', 'auto'],
    ]);
    expect(parsed.samples[0]).toMatchObject({ sample_code: 'S1', heat: 'K24-0412' });
  });
});
