import { describe, expect, it } from 'vitest';
import { decidedBy, elementsOf, readingInWords, roleInWords } from '../../../../src/features/imports/column-roles.ts';

describe('column roles', () => {
  it('names each role the server can report and falls back to the role itself', () => {
    expect(roleInWords('sample_code')).toBe('Sample code');
    expect(roleInWords('measured_at')).toBe('Time measured');
    expect(roleInWords('some_new_role')).toBe('some new role');
  });

  it("orders elements as the wide file's columns, then those only the values name (long layout)", () => {
    const columns = [{ role: 'sample_code' }, { role: 'element', element: 'Mn' }, { role: 'element', element: 'C' }];
    expect(
      elementsOf(columns, [
        { C: '0.45', Mn: '0.75' },
        { Si: '0.2', C: '0.44' },
      ]),
    ).toEqual(['Mn', 'C', 'Si']);
    expect(elementsOf([{ role: 'element_name' }, { role: 'value' }], [{ Cu: '0.1' }, { Zn: '<0.001', Cu: '0.2' }])).toEqual(['Cu', 'Zn']);
  });

  it('says how each column is stored and who decided it', () => {
    expect(readingInWords({ role: 'element', element: 'Mn', unit: 'ppm' })).toBe('Element Mn, in ppm');
    expect(readingInWords({ role: 'field', field: 'carbon_equivalent' })).toBe('Identification field “carbon_equivalent”');
    expect(readingInWords({ role: 'ignored' })).toBe('Not imported');
    expect(readingInWords({ role: 'heat' })).toBe('Heat / lot');
    expect(decidedBy({ source: 'auto' })).toBe('Detected from the header');
    expect(decidedBy({ source: 'profile' })).toBe('Import profile');
    expect(decidedBy({ source: 'auto', kept: true })).toBe('Confirmed in the profile');
  });
});
