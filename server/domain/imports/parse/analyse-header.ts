// Decides what each header is: an identification column, an element column (with its unit),
// a long-layout column, an extra identification field, or ignored. A profile's mappings come
// first; the rest is recognised automatically (header-aliases.ts, element-header.ts).
import type { Unit } from '../../chemistry/units.ts';
import type { ImportProfileDefinition } from '../import-profiles.schemas.ts';
import { namedHeaders } from '../import-profiles.rules.ts';
import { isReservedKey } from '../../../lib/reserved-keys.ts';
import { aliasRole, profileHeaderKey } from './header-aliases.ts';
import { parseElementHeader } from './element-header.ts';
import { type ColumnRole, type ColumnRoleName, FileLayoutError, type Issue, type Layout } from './types.ts';

export interface HeaderAnalysis {
  layout: Layout;
  columns: ColumnRole[];
  warnings: Issue[];
}

const SINGLE_ROLES: ColumnRoleName[] = [
  'sample_code',
  'heat',
  'grade',
  'kind',
  'burn_number',
  'measured_at',
  'element_name',
  'value',
  'unit',
];

function profileRole(path: (string | number)[], profile: ImportProfileDefinition): Omit<ColumnRole, 'index' | 'header' | 'source'> {
  const [group, key] = path;
  if (group === 'columns' && key === 'fields') return { role: 'field', field: String(path[2]) };
  if (group === 'columns') return { role: key as ColumnRoleName };
  if (group === 'long_columns') return { role: key === 'element' ? 'element_name' : (key as ColumnRoleName) };
  if (group === 'element_columns') {
    const column = profile.element_columns[Number(key)];
    return { role: 'element', element: column.element, ...(column.unit ? { unit: column.unit, unit_source: 'profile' as const } : {}) };
  }
  return { role: 'ignored' };
}

/** The roles a profile gives, and the headers whose automatic reading it confirms (`keep_columns`). */
function assignProfile(headers: string[], line: number, profile: ImportProfileDefinition) {
  const roles: (ColumnRole | undefined)[] = headers.map(() => undefined);
  const kept = new Set<number>();
  const missing: Issue[] = [];
  for (const { path, header } of namedHeaders(profile)) {
    const index = headers.findIndex((h, i) => !roles[i] && !kept.has(i) && profileHeaderKey(h) === profileHeaderKey(header));
    if (index < 0) {
      missing.push({
        line,
        column: header,
        code: 'missing_column',
        message: `The profile reads "${header}" as ${path.join('.')}, but the header on line ${line} has no such column.`,
      });
      continue;
    }
    if (path[0] === 'keep_columns') kept.add(index);
    else roles[index] = { index, header: headers[index], source: 'profile', ...profileRole(path, profile) };
  }
  if (missing.length > 0) throw new FileLayoutError(missing);
  return { roles, kept };
}

export function analyseHeader(
  rawHeader: string[],
  line: number,
  profile: ImportProfileDefinition | undefined,
  defaultUnit: Unit | undefined,
): HeaderAnalysis {
  const headers = rawHeader.map((cell) => cell.trim());
  const { roles, kept } = profile
    ? assignProfile(headers, line, profile)
    : { roles: headers.map(() => undefined), kept: new Set<number>() };
  const warnings: Issue[] = [];
  const elementErrors: Issue[] = [];
  const taken = new Set(roles.flatMap((role) => (role && SINGLE_ROLES.includes(role.role) ? [role.role] : [])));
  const auto = (index: number, rest: Omit<ColumnRole, 'index' | 'header' | 'source'>) => {
    roles[index] = { index, header: headers[index], source: 'auto', ...(kept.has(index) ? { kept: true } : {}), ...rest };
  };
  headers.forEach((header, index) => {
    if (roles[index]) return;
    if (header === '') return auto(index, { role: 'ignored' });
    const alias = aliasRole(header);
    if (alias && alias !== 'ignored' && taken.has(alias)) {
      warnings.push({
        line,
        column: header,
        code: 'duplicate_role',
        message: `"${header}" looks like another ${alias} column; it is kept as an identification field.`,
      });
      return auto(index, { role: 'field' });
    }
    if (alias) {
      taken.add(alias);
      return auto(index, { role: alias });
    }
    const parsed = parseElementHeader(header);
    if (parsed.kind === 'element')
      return auto(index, {
        role: 'element',
        element: parsed.element,
        ...(parsed.unit ? { unit: parsed.unit, unit_source: 'header' as const } : {}),
      });
    if (parsed.kind === 'unknown_element') {
      elementErrors.push({
        line,
        column: header,
        code: 'unknown_element_header',
        message: `The column "${header}" carries a unit but "${parsed.symbol}" is not an element symbol.`,
      });
    } else if (parsed.kind === 'unknown_unit') {
      elementErrors.push({
        line,
        column: header,
        code: 'unknown_unit_header',
        message: `The column "${header}" names ${parsed.element} in "${parsed.unit}", which is not a mass-fraction unit (%, ppm, mg/kg, ppb, µg/kg).`,
      });
    } else if (parsed.kind === 'short_unknown') {
      warnings.push({
        line,
        column: header,
        code: 'unrecognised_header',
        message: `"${header}" is not an element symbol; it is kept as an identification field.`,
      });
    }
    auto(index, { role: 'field' });
  });
  const columns = roles as ColumnRole[];
  const layout =
    profile?.layout ?? (taken.has('element_name') && taken.has('value') && !columns.some((c) => c.role === 'element') ? 'long' : 'wide');
  settleLayout(columns, layout);
  if (layout === 'wide' && elementErrors.length > 0) throw new FileLayoutError(elementErrors);
  resolveUnits(columns, profile?.default_unit ?? undefined, defaultUnit);
  nameFields(columns);
  checkRequired(columns, layout, line);
  return { layout, columns, warnings };
}

/** Columns that only make sense in the other layout become identification fields. */
function settleLayout(columns: ColumnRole[], layout: Layout): void {
  const foreign: ColumnRoleName[] = layout === 'wide' ? ['element_name', 'value', 'unit'] : ['element'];
  for (const column of columns) {
    if (column.source === 'auto' && foreign.includes(column.role)) {
      column.role = 'field';
      delete column.element;
      delete column.unit;
      delete column.unit_source;
    }
  }
}

function resolveUnits(columns: ColumnRole[], profileUnit: Unit | undefined, callerUnit: Unit | undefined): void {
  for (const column of columns) {
    // A long layout's value column takes the default unit for rows whose unit cell is blank.
    if (column.role !== 'element' && column.role !== 'value') continue;
    if (column.role === 'element' && !column.unit && column.source === 'profile') {
      const fromHeader = parseElementHeader(column.header);
      if (fromHeader.kind === 'element' && fromHeader.unit) Object.assign(column, { unit: fromHeader.unit, unit_source: 'header' });
    }
    if (!column.unit) {
      Object.assign(
        column,
        profileUnit ? { unit: profileUnit, unit_source: 'profile' } : { unit: callerUnit ?? '%', unit_source: 'default' },
      );
    }
  }
}

function nameFields(columns: ColumnRole[]): void {
  const used = new Set(columns.flatMap((c) => (c.role === 'field' && c.field ? [c.field] : [])));
  for (const column of columns) {
    if (column.role !== 'field' || column.field) continue;
    let key = column.header;
    for (let n = 2; used.has(key); n += 1) key = `${column.header} #${n}`;
    used.add(key);
    column.field = key;
  }
}

function checkRequired(columns: ColumnRole[], layout: Layout, line: number): void {
  const has = (role: ColumnRoleName) => columns.some((c) => c.role === role);
  const issues: Issue[] = [];
  for (const column of columns.filter((c) => c.role === 'field' && isReservedKey(c.field!))) {
    issues.push({
      line,
      column: column.header,
      code: 'reserved_header',
      message: `"${column.header}" cannot name an identification field; rename the column or ignore it in an import profile.`,
    });
  }
  if (!has('sample_code')) {
    issues.push({
      line,
      code: 'no_sample_code_column',
      message: `No column on line ${line} is recognised as the sample code: name it "Sample" or "Sample ID", or map it in an import profile.`,
    });
  }
  if (layout === 'wide') {
    if (!has('element'))
      issues.push({
        line,
        code: 'no_element_columns',
        message: `No column on line ${line} is an element (headers such as "Mn", "C %", "Si [ppm]").`,
      });
    const byElement = new Map<string, ColumnRole>();
    for (const column of columns.filter((c) => c.role === 'element')) {
      const first = byElement.get(column.element!);
      if (first) {
        issues.push({
          line,
          column: column.header,
          code: 'duplicate_element_column',
          message: `"${column.header}" and "${first.header}" both hold ${column.element}; ignore one of them in an import profile.`,
        });
      } else byElement.set(column.element!, column);
    }
  } else {
    if (!has('element_name'))
      issues.push({ line, code: 'no_element_column', message: `The long layout needs a column naming the element ("Element").` });
    if (!has('value'))
      issues.push({ line, code: 'no_value_column', message: `The long layout needs a column holding the value ("Value").` });
  }
  if (issues.length > 0) throw new FileLayoutError(issues);
}
