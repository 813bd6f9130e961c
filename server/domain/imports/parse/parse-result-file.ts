// parseResultFile: the bytes of an instrument result file → samples with burns and values in %.
// Pure (no database, no clock). Whole-file problems throw FileLayoutError; problems on single
// lines are returned in `rejected` (the line is not used) or `warnings` (the line is used).
import type { Unit } from '../../chemistry/units.ts';
import type { ImportProfileDefinition } from '../import-profiles.schemas.ts';
import { analyseHeader } from './analyse-header.ts';
import { type ReviewMethod, reviewColumns } from './column-review.ts';
import { decodeBytes } from './decode.ts';
import { detectDecimalSeparator } from './detect-decimal.ts';
import { detectDelimiter, firstNonBlankLine, physicalLines } from './detect-delimiter.ts';
import { SampleGrouper } from './grouping.ts';
import { readLongRow } from './long-rows.ts';
import { isBlankRecord, normaliseLineEnds, readRecords } from './read-records.ts';
import { rowColumns, type RowReading } from './row-cells.ts';
import { type DecimalSeparator, type Delimiter, type Issue, layoutError, type ParsedFile } from './types.ts';
import { readWideRow } from './wide-rows.ts';

export interface ParseOptions {
  /** How to read the file; without one everything is detected. */
  profile?: ImportProfileDefinition;
  /** Unit for element columns whose header names none and the profile sets none (e.g. the method's). */
  defaultUnit?: Unit;
  /** Burn times after this instant are refused (the caller's clock plus its skew allowance); without it none is. */
  latestTime?: string;
  /** The method the file is imported under: element columns it would misread are named in warnings. */
  method?: ReviewMethod;
}

const DELIMITERS: Record<string, Delimiter> = { ',': ',', ';': ';', tab: '\t' };

export function parseResultFile(bytes: Uint8Array, options: ParseOptions = {}): ParsedFile {
  const { profile } = options;
  const decoded = decodeBytes(bytes, profile?.encoding ?? 'auto');
  const text = normaliseLineEnds(decoded.text);
  const lines = physicalLines(text);
  const headerRow = profile ? profile.header_row : firstNonBlankLine(lines);
  if (headerRow === undefined) throw layoutError('empty_file', 'The file is empty.');
  if (headerRow > lines.length || lines[headerRow - 1].trim() === '') {
    throw layoutError(
      'no_header',
      `Line ${headerRow} should hold the header but is ${headerRow > lines.length ? 'past the end of the file' : 'blank'}.`,
      { line: headerRow },
    );
  }
  const delimiter = profile && profile.delimiter !== 'auto' ? DELIMITERS[profile.delimiter] : detectDelimiter(lines, headerRow);
  const [headerRecord, ...records] = readRecords(text, delimiter, headerRow);
  const header = headerRecord.cells.map((cell) => cell.trim());
  const analysis = analyseHeader(headerRecord.cells, headerRow, profile, options.defaultUnit);
  const dataRecords = records.filter((record) => !isBlankRecord(record.cells));
  if (dataRecords.length === 0)
    throw layoutError('no_rows', `The file has a header on line ${headerRow} but no data lines.`, { line: headerRow });

  const { columns, layout } = analysis;
  const valueColumns = columns.filter((c) => c.role === (layout === 'wide' ? 'element' : 'value')).map((c) => c.index);
  const decimal: DecimalSeparator =
    profile && profile.decimal_separator !== 'auto'
      ? profile.decimal_separator
      : detectDecimalSeparator(
          dataRecords.map((r) => r.cells),
          valueColumns,
          delimiter,
        );

  const warnings: Issue[] = [...analysis.warnings];
  if (options.method && layout === 'wide') warnings.push(...reviewColumns(columns, options.method, headerRow));
  const rejected: Issue[] = [];
  const headerOf = (key: string) =>
    columns.find((c) => (key.startsWith('fields.') ? c.role === 'field' && `fields.${c.field}` === key : c.role === key))?.header;
  const reading: RowReading = {
    columns: rowColumns(columns),
    elements: columns.filter((c) => c.role === 'element'),
    decimal,
    time: {
      format: profile?.time.format ?? 'auto',
      zone: profile?.time.time_zone ?? profile?.time.utc_offset ?? null,
      latest: options.latestTime ? Date.parse(options.latestTime) : Number.POSITIVE_INFINITY,
      naiveLines: [],
      ambiguousLines: [],
    },
    grouper: new SampleGrouper(warnings, rejected, headerOf),
    warnings,
  };
  if (layout === 'wide') {
    for (const record of dataRecords) readWideRow(record, reading);
  } else {
    const long = {
      element: columns.find((c) => c.role === 'element_name')!,
      value: columns.find((c) => c.role === 'value')!,
      unit: columns.find((c) => c.role === 'unit'),
    };
    for (const record of dataRecords) readLongRow(record, reading, long);
  }
  warnTimes(reading, warnings);
  const samples = reading.grouper.finish();
  const burns = samples.reduce((n, s) => n + s.burns.length, 0);
  const values = samples.reduce((n, s) => s.burns.reduce((m, b) => m + Object.keys(b.values).length, n), 0);
  return {
    encoding: decoded.encoding,
    bom: decoded.bom,
    delimiter,
    decimal_separator: decimal,
    layout,
    header_row: headerRow,
    header,
    columns,
    samples,
    time_zone: reading.columns.measuredAt ? (reading.time.zone ?? 'UTC') : null,
    naive_time_lines: reading.time.naiveLines,
    warnings,
    rejected,
    counts: { rows: dataRecords.length, burns, values },
  };
}

function warnTimes({ time, columns }: RowReading, warnings: Issue[]): void {
  const column = columns.measuredAt?.header;
  if (time.naiveLines.length > 0) {
    warnings.push({
      column,
      code: 'time_without_offset',
      message:
        "Times without a UTC offset were read as UTC; set the instrument's time zone in an import profile if it writes local time (times within an hour of a correction set's start are refused until then).",
    });
  }
  if (time.ambiguousLines.length > 0) {
    const lines = time.ambiguousLines;
    warnings.push({
      line: lines[0],
      column,
      code: 'ambiguous_time',
      message: `${lines.length} time(s) fall in the hour ${time.zone} repeats when the clocks go back (line ${lines.slice(0, 5).join(', ')}${lines.length > 5 ? ' …' : ''}); each was read as the first occurrence (summer time).`,
    });
  }
}
