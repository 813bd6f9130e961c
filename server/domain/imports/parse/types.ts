// What the result-file parser returns. Line numbers are 1-based physical lines of the file
// (the header line counts), so an analyst can open the file and find the line.
import type { Qualifier } from '../../chemistry/measured-value.ts';
import type { Unit } from '../../chemistry/units.ts';

export interface Issue {
  line?: number;
  /** The column's header as written in the file. */
  column?: string;
  message: string;
  /** Stable machine-readable reason, e.g. `invalid_value`, `column_count`. */
  code: string;
}

export type ColumnRoleName =
  | 'sample_code'
  | 'heat'
  | 'grade'
  | 'kind'
  | 'burn_number'
  | 'measured_at'
  | 'field'
  | 'element'
  | 'element_name'
  | 'value'
  | 'unit'
  | 'ignored';

/** What one header was recognised as. */
export interface ColumnRole {
  index: number;
  header: string;
  role: ColumnRoleName;
  /** role `element`: the canonical symbol. */
  element?: string;
  /** role `element`: the unit its cells are written in, and where that came from. */
  unit?: Unit;
  unit_source?: 'header' | 'profile' | 'default';
  /** role `field`: the key in `ParsedSample.fields`. */
  field?: string;
  /** How the role was decided. */
  source: 'profile' | 'auto';
  /** The profile confirms the automatic reading of this header (`keep_columns`). */
  kept?: boolean;
  /** Why this column's reading needs a person's decision before import (column-review.ts). */
  attention?: { code: ColumnAttentionCode; message: string };
}

/** Readings that are often wrong: a computed index read as an element, the method's balance, an element the method does not list. */
export type ColumnAttentionCode = 'computed_index' | 'balance_element' | 'not_in_method';

export interface ParsedValue {
  /** Mass fraction in %, as an exact decimal string ("0.75"); null for n.d. */
  value: string | null;
  qualifier: Qualifier | null;
  /** The cell as written. */
  raw: string;
  /** The unit the cell was written in. */
  unit: Unit;
}

export interface ParsedBurn {
  line: number;
  burn_number: number;
  /** ISO 8601 UTC. */
  measured_at?: string;
  /** Keyed by canonical element symbol. */
  values: Record<string, ParsedValue>;
}

export interface ParsedSample {
  sample_code: string;
  heat?: string;
  grade?: string;
  kind?: string;
  fields: Record<string, string>;
  first_line: number;
  burns: ParsedBurn[];
  /** Rejected issues on this sample's lines. */
  rejected: Issue[];
}

export type Delimiter = ',' | ';' | '\t';
export type DecimalSeparator = '.' | ',';
export type Layout = 'wide' | 'long';

export interface ParsedFile {
  encoding: 'utf-8' | 'windows-1252';
  /** Whether the file began with a UTF-8 byte order mark. */
  bom: boolean;
  delimiter: Delimiter;
  decimal_separator: DecimalSeparator;
  layout: Layout;
  /** 1-based line of the header. */
  header_row: number;
  header: string[];
  columns: ColumnRole[];
  samples: ParsedSample[];
  warnings: Issue[];
  /** Every rejected line (a line can appear more than once, one issue per bad cell). */
  rejected: Issue[];
  /** The zone times without an offset were read in (profile's zone or offset, else "UTC"); null without a time column. */
  time_zone: string | null;
  /** Lines whose time had no offset and no zone to read it in (read as UTC). */
  naive_time_lines: number[];
  counts: { rows: number; burns: number; values: number };
}

/** A problem with the whole file: the caller answers 422 and imports nothing. */
export class FileLayoutError extends Error {
  constructor(public readonly issues: Issue[]) {
    super(issues.map((issue) => issue.message).join(' '));
    this.name = 'FileLayoutError';
  }
}

export function layoutError(code: string, message: string, where: { line?: number; column?: string } = {}): FileLayoutError {
  return new FileLayoutError([{ ...where, message, code }]);
}
