// Reading the non-chemistry cells of a data row: cell count, identification, burn number, time.
// Shared by the wide and long row readers. Each reader returns an Issue instead of throwing,
// so one row can report every broken cell at once.
import { checkIdentity, type IdentityColumns } from './identity-limits.ts';
import type { RawRecord } from './read-records.ts';
import { parseBurnTime, type TimeFormat } from './times.ts';
import type { RowIdentity, SampleGrouper, SampleState } from './grouping.ts';
import type { ColumnRole, DecimalSeparator, Issue } from './types.ts';

export interface RowColumns extends IdentityColumns {
  width: number;
  burnNumber?: ColumnRole;
  measuredAt?: ColumnRole;
}

export function rowColumns(columns: ColumnRole[]): RowColumns {
  const one = (role: ColumnRole['role']) => columns.find((c) => c.role === role);
  return {
    width: columns.length,
    sampleCode: one('sample_code')!,
    heat: one('heat'),
    grade: one('grade'),
    kind: one('kind'),
    burnNumber: one('burn_number'),
    measuredAt: one('measured_at'),
    fields: columns.filter((c) => c.role === 'field'),
  };
}

/** Too few cells, or extra cells that hold something: the row does not fit the header. */
function cellCountIssue(record: RawRecord, width: number): Issue | undefined {
  const { cells, line } = record;
  if (cells.length === width) return undefined;
  if (cells.length > width && cells.slice(width).every((cell) => cell.trim() === '')) return undefined;
  return { line, code: 'column_count', message: `Line ${line} has ${cells.length} cells where the header has ${width}.` };
}

function cell(cells: string[], column: ColumnRole | undefined): string | undefined {
  const text = column ? cells[column.index]?.trim() : undefined;
  return text ? text : undefined;
}

function readIdentity(cells: string[], line: number, columns: RowColumns): RowIdentity | Issue {
  const sampleCode = cell(cells, columns.sampleCode);
  if (!sampleCode)
    return { line, column: columns.sampleCode.header, code: 'missing_sample_code', message: `Line ${line} has no sample code.` };
  const fields: Record<string, string> = {};
  for (const column of columns.fields) {
    const value = cell(cells, column);
    if (value) fields[column.field!] = value;
  }
  return {
    sample_code: sampleCode,
    heat: cell(cells, columns.heat),
    grade: cell(cells, columns.grade),
    kind: cell(cells, columns.kind),
    fields,
  };
}

const BURN_NUMBER = /^\d{1,6}(\.0+)?$/;

/** The written burn number, undefined when the row has none, or an issue. */
export function readBurnNumber(cells: string[], line: number, columns: RowColumns): number | undefined | Issue {
  const text = cell(cells, columns.burnNumber);
  if (text === undefined) return undefined;
  const number = BURN_NUMBER.test(text) ? Number.parseInt(text, 10) : 0;
  if (number < 1)
    return {
      line,
      column: columns.burnNumber!.header,
      code: 'invalid_burn_number',
      message: `"${text}" on line ${line} is not a burn number (1, 2, 3 …).`,
    };
  return number;
}

export interface TimeSettings {
  format: TimeFormat;
  /** How times written without an offset are read: an IANA zone, a fixed offset, or null (as UTC). */
  zone: string | null;
  /** Times later than this (epoch ms: the server's clock plus a small skew allowance) are refused. */
  latest: number;
  /** Lines whose time had no offset and no zone to read it in, so it was read as UTC. */
  naiveLines: number[];
  /** Lines whose time fell in the hour the zone repeats when the clocks go back. */
  ambiguousLines: number[];
}

export function readTime(cells: string[], line: number, columns: RowColumns, settings: TimeSettings): string | undefined | Issue {
  const text = cell(cells, columns.measuredAt);
  if (text === undefined) return undefined;
  const column = columns.measuredAt!.header;
  const parsed = parseBurnTime(text, settings.format, settings.zone ?? 'Z');
  if (!parsed) {
    const expected = settings.format === 'auto' ? 'ISO 8601, YYYY-MM-DD HH:mm[:ss] or DD.MM.YYYY HH:mm[:ss]' : settings.format;
    return { line, column, code: 'invalid_time', message: `"${text}" on line ${line} is not a valid time (${expected}).` };
  }
  if ('skipped' in parsed) {
    const message = `"${text}" on line ${line} does not exist in ${settings.zone}: the clocks go forward over it.`;
    return { line, column, code: 'invalid_time', message };
  }
  if (Date.parse(parsed.iso) > settings.latest) {
    return { line, column, code: 'future_time', message: `"${text}" on line ${line} (${parsed.iso}) is in the future.` };
  }
  if (!parsed.hadOffset && settings.zone === null) settings.naiveLines.push(line);
  if (parsed.ambiguous) settings.ambiguousLines.push(line);
  return parsed.iso;
}

export function isIssue(value: unknown): value is Issue {
  return typeof value === 'object' && value !== null && 'code' in value && 'message' in value;
}

/** Everything a row reader needs, built once per file. */
export interface RowReading {
  columns: RowColumns;
  elements: ColumnRole[];
  decimal: DecimalSeparator;
  time: TimeSettings;
  grouper: SampleGrouper;
  warnings: Issue[];
}

/**
 * Checks the cell count and the identification and puts the row into its sample; undefined when
 * rejected. A row whose identification is too long is rejected with its sample (per_sample mode
 * leaves that sample out) or, when the sample code or heat itself is too long, on its own.
 */
export function enterRow(record: RawRecord, reading: RowReading): { identity: RowIdentity; state: SampleState } | undefined {
  const { columns, grouper } = reading;
  const countIssue = cellCountIssue(record, columns.width);
  if (countIssue) return void grouper.reject([countIssue]);
  const read = readIdentity(record.cells, record.line, columns);
  if (isIssue(read)) return void grouper.reject([read]);
  const { identity, issues, unidentified } = checkIdentity(read, record.line, columns);
  if (unidentified) return void grouper.reject(issues);
  if (issues.length > 0) return void grouper.reject(issues, grouper.enter(identity, record.line, { compare: false }));
  return { identity, state: grouper.enter(identity, record.line) };
}
