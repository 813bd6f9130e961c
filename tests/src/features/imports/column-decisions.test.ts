import { describe, expect, it } from 'vitest';
import {
  blocksImport,
  decisionProblem,
  isColumnReviewWarning,
  suggestedFieldKey,
  withDecisions,
  type PreviewColumn,
} from '../../../../src/features/imports/column-decisions.ts';

const ce: PreviewColumn = {
  header: 'CE %',
  role: 'element',
  element: 'Ce',
  unit: '%',
  source: 'auto',
  attention: { code: 'computed_index', message: '…' },
};
const co: PreviewColumn = { ...ce, header: 'Co [ppm]', element: 'Co', unit: 'ppm', attention: { code: 'not_in_method', message: '…' } };

describe('column decisions', () => {
  it('only a computed index and the balance element hold up the import', () => {
    expect(blocksImport(ce)).toBe(true);
    expect(blocksImport({ ...ce, attention: { code: 'balance_element', message: '…' } })).toBe(true);
    expect(blocksImport(co)).toBe(false);
    expect(blocksImport({ ...ce, attention: undefined })).toBe(false);
    expect(isColumnReviewWarning({ code: 'not_in_method' })).toBe(true);
    expect(isColumnReviewWarning({ code: 'duplicate_role' })).toBe(false);
  });

  it('suggests a field key the profile accepts', () => {
    expect(suggestedFieldKey(ce)).toBe('carbon_equivalent');
    expect(suggestedFieldKey({ ...co, header: 'Cast station #2' })).toBe('cast_station_2');
    expect(suggestedFieldKey({ ...co, header: '%%' })).toBe('column');
  });

  it('names what is missing in a decision', () => {
    expect(decisionProblem(undefined)).toBe('Choose what to do with this column.');
    expect(decisionProblem({ action: 'element', element: '' })).toMatch(/element symbol/);
    expect(decisionProblem({ action: 'field', key: 'Carbon Eq' })).toMatch(/lower-case/);
    expect(decisionProblem({ action: 'field', key: 'carbon_equivalent' })).toBeNull();
    expect(decisionProblem({ action: 'keep' })).toBeNull();
  });

  it('adds each decision to its list of the profile, keeping what the profile had', () => {
    const profile = {
      ignore_columns: ['Operator'],
      element_columns: [{ header: 'Mn (calc)', element: 'Mn' }],
      columns: { heat: 'Heat No.', fields: { furnace: 'Furnace' } },
      keep_columns: [],
    };
    const next = withDecisions(profile, [
      { column: ce, decision: { action: 'field', key: 'carbon_equivalent' } },
      { column: co, decision: { action: 'element', element: 'Cr ' } },
      { column: { ...co, header: 'Fe %' }, decision: { action: 'ignore' } },
      { column: { ...co, header: 'W %' }, decision: { action: 'keep' } },
    ]);
    expect(next).toEqual({
      ignore_columns: ['Operator', 'Fe %'],
      element_columns: [
        { header: 'Mn (calc)', element: 'Mn' },
        { header: 'Co [ppm]', element: 'Cr', unit: 'ppm' },
      ],
      columns: { heat: 'Heat No.', fields: { furnace: 'Furnace', carbon_equivalent: 'CE %' } },
      keep_columns: ['W %'],
    });
    expect(profile.ignore_columns).toEqual(['Operator']); // the profile passed in is not changed
    expect(withDecisions(undefined, [{ column: ce, decision: { action: 'keep' } }])).toEqual({
      ignore_columns: [],
      element_columns: [],
      columns: {},
      keep_columns: ['CE %'],
    });
  });
});
