// Rules a profile must satisfy as a whole (the field schemas check each field alone).
// Used by zod's superRefine on create, and on the merged profile on update.
import type { z } from 'zod';
import { profileHeaderKey } from './parse/header-aliases.ts';

interface ProfileShape {
  delimiter: string;
  decimal_separator: string;
  layout: 'wide' | 'long';
  columns: Partial<Record<'sample_code' | 'heat' | 'grade' | 'kind' | 'burn_number' | 'measured_at', string>> & {
    fields?: Record<string, string>;
  };
  long_columns: { element: string; value: string; unit?: string } | null;
  element_columns: { header: string; element: string }[];
  ignore_columns: string[];
  keep_columns: string[];
}

type Path = (string | number)[];

/** Every header the profile names, with where it names it, in declaration order. */
export function namedHeaders(profile: ProfileShape): { path: Path; header: string }[] {
  const named: { path: Path; header: string }[] = [];
  const { fields, ...roles } = profile.columns;
  for (const [role, header] of Object.entries(roles)) if (header) named.push({ path: ['columns', role], header });
  for (const [key, header] of Object.entries(fields ?? {})) named.push({ path: ['columns', 'fields', key], header });
  if (profile.long_columns) {
    for (const [role, header] of Object.entries(profile.long_columns)) if (header) named.push({ path: ['long_columns', role], header });
  }
  profile.element_columns.forEach((column, i) => named.push({ path: ['element_columns', i, 'header'], header: column.header }));
  profile.ignore_columns.forEach((header, i) => named.push({ path: ['ignore_columns', i], header }));
  profile.keep_columns.forEach((header, i) => named.push({ path: ['keep_columns', i], header }));
  return named;
}

export function checkProfileRules(profile: ProfileShape, ctx: z.RefinementCtx): void {
  const issue = (path: Path, message: string) => ctx.addIssue({ code: 'custom', path, message });
  if (profile.layout === 'long' && !profile.long_columns) issue(['long_columns'], 'the long layout needs the element and value columns');
  if (profile.layout === 'wide' && profile.long_columns) issue(['long_columns'], 'only the long layout uses long_columns; set it to null');
  if (profile.layout === 'long' && profile.element_columns.length > 0)
    issue(['element_columns'], 'only the wide layout uses element_columns');
  if (profile.delimiter === ',' && profile.decimal_separator === ',') {
    issue(['decimal_separator'], 'a comma-delimited file cannot also use the comma as decimal separator; choose `;` or tab as delimiter');
  }
  const seen = new Map<string, Path>();
  for (const { path, header } of namedHeaders(profile)) {
    const key = profileHeaderKey(header);
    const first = seen.get(key);
    if (first) issue(path, `the header "${header}" is already used by ${first.join('.')}`);
    else seen.set(key, path);
  }
  const elements = new Map<string, number>();
  profile.element_columns.forEach((column, i) => {
    const first = elements.get(column.element);
    if (first !== undefined) issue(['element_columns', i, 'element'], `${column.element} is already read from element_columns.${first}`);
    else elements.set(column.element, i);
  });
}
