// A row's identification obeys the limits of a JSON push (SAMPLE_TEXT_LIMITS): a cell longer
// than that is an issue naming line and column, like any other bad cell. Too-long text is left
// out of the identity handed on, so that it never reaches a stored sample or another message.
import { SAMPLE_TEXT_LIMITS } from '../../samples/sample-limits.ts';
import type { RowIdentity } from './grouping.ts';
import type { ColumnRole, Issue } from './types.ts';

/** The identification columns of a file (row-cells.ts RowColumns). */
export interface IdentityColumns {
  sampleCode: ColumnRole;
  heat?: ColumnRole;
  grade?: ColumnRole;
  kind?: ColumnRole;
  fields: ColumnRole[];
}

/** Headers are shown up to this length in these issues. */
const SHOWN = 60;

export function shownText(text: string): string {
  return text.length > SHOWN ? `${text.slice(0, SHOWN)}…` : text;
}

function tooLong(line: number, column: ColumnRole, what: string, length: number, max: number): Issue {
  const header = shownText(column.header);
  return {
    line,
    column: header,
    code: 'too_long',
    message: `Line ${line}, ${header}: the ${what} has ${length} characters, at most ${max} are accepted.`,
  };
}

export interface CheckedIdentity {
  identity: RowIdentity;
  issues: Issue[];
  /** The sample code or heat is too long: the row cannot be put into a sample. */
  unidentified: boolean;
}

export function checkIdentity(identity: RowIdentity, line: number, columns: IdentityColumns): CheckedIdentity {
  const { identification, fieldName, fieldValue, fields: maxFields } = SAMPLE_TEXT_LIMITS;
  const issues: Issue[] = [];
  const checked: RowIdentity = { ...identity, fields: { ...identity.fields } };
  let unidentified = false;
  const single = [
    ['sample_code', columns.sampleCode, 'sample code', identification],
    ['heat', columns.heat, 'heat', identification],
    ['grade', columns.grade, 'grade', identification],
    ['kind', columns.kind, 'kind', fieldValue],
  ] as const;
  for (const [key, column, what, max] of single) {
    const value = identity[key];
    if (column === undefined || value === undefined || value.length <= max) continue;
    issues.push(tooLong(line, column, what, value.length, max));
    if (key === 'sample_code' || key === 'heat') unidentified = true;
    else delete checked[key];
  }
  for (const column of columns.fields) {
    const name = column.field!;
    const value = identity.fields[name];
    if (value === undefined) continue;
    if (name.length > fieldName) issues.push(tooLong(line, column, 'name of this identification field', name.length, fieldName));
    else if (value.length > fieldValue) issues.push(tooLong(line, column, 'value', value.length, fieldValue));
    else continue;
    delete checked.fields[name];
  }
  const count = Object.keys(identity.fields).length;
  if (count > maxFields) {
    issues.push({
      line,
      code: 'too_many_fields',
      message: `Line ${line} holds ${count} identification fields, at most ${maxFields} are accepted: ignore some columns in an import profile.`,
    });
    checked.fields = {};
  }
  return { identity: checked, issues, unidentified };
}
