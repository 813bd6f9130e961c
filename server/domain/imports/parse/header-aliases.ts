// Identification headers recognised without a profile. Matching ignores case, and treats
// "_", "-", ".", "/", ":" and runs of spaces alike ("Sample_ID", "sample-id", "Sample ID.").
// docs/imports/auto-detection.md carries the same list as a table; a unit test keeps them equal.
import type { ColumnRoleName } from './types.ts';

type AliasRole = Exclude<ColumnRoleName, 'element' | 'field'>;

export const HEADER_ALIASES: Record<AliasRole, readonly string[]> = {
  sample_code: ['sample', 'sample code', 'sample id', 'sample no', 'sample number', 'sample name', 'specimen', 'specimen id'],
  heat: ['heat', 'heat no', 'heat number', 'heat id', 'lot', 'lot no', 'lot number', 'batch', 'cast', 'cast no', 'melt', 'melt no'],
  grade: ['grade', 'steel grade', 'alloy', 'alloy grade', 'material'],
  kind: ['kind', 'sample kind', 'sample type', 'type'],
  burn_number: ['burn', 'burn no', 'burn number', 'replicate', 'rep', 'spark', 'spark no'],
  measured_at: ['time', 'timestamp', 'date time', 'datetime', 'measured at', 'measurement time', 'analysed at', 'analyzed at'],
  element_name: ['element', 'analyte'],
  value: ['value', 'result', 'concentration', 'conc'],
  unit: ['unit', 'units'],
  // Row counters written by spreadsheets. "No" is also nobelium's symbol, which no metals
  // lab determines; an import profile can still map a column to No if it ever must.
  ignored: ['no', 'nr', 'row', 'line', 'index', '#'],
};

export const ROLE_DESCRIPTIONS: Record<AliasRole, string> = {
  sample_code: 'sample code (required)',
  heat: 'heat or lot number',
  grade: 'grade',
  kind: 'sample kind (preliminary, final, ladle, incoming, control …)',
  burn_number: 'burn (replicate) number; without it burns count 1, 2, 3 … within a sample',
  measured_at: 'time of the burn',
  element_name: 'long layout: the element symbol',
  value: 'long layout: the value',
  unit: 'long layout: the unit of the value',
  ignored: 'ignored (row counter)',
};

function headerKey(header: string): string {
  const trimmed = header.trim().toLowerCase();
  if (trimmed === '#') return '#';
  return trimmed.replace(/[\s_\-./:#]+/g, ' ').trim();
}

const BY_KEY = new Map<string, AliasRole>(
  (Object.entries(HEADER_ALIASES) as [AliasRole, readonly string[]][]).flatMap(([role, aliases]) =>
    aliases.map((alias) => [alias, role] as const),
  ),
);

export function aliasRole(header: string): AliasRole | undefined {
  return BY_KEY.get(headerKey(header));
}

/** The recognised headers as one sentence per role, for OpenAPI descriptions. */
export function describeHeaderAliases(): string {
  return (Object.entries(HEADER_ALIASES) as [AliasRole, readonly string[]][])
    .map(([role, aliases]) => `${ROLE_DESCRIPTIONS[role]}: ${aliases.map((a) => `\`${a}\``).join(', ')}`)
    .join('; ');
}

/** How a profile's header names are matched: ignoring case, surrounding and repeated spaces. */
export function profileHeaderKey(header: string): string {
  return header.trim().toLowerCase().replace(/\s+/g, ' ');
}
