// Splits the text into records with csv-parse, remembering the physical line each record starts
// on. Empty lines are kept as records (csv-parse would otherwise hide them from the line count);
// the column count is checked by the row readers, not here (relax_column_count).
import { parse } from 'csv-parse/sync';
import { type Delimiter, layoutError } from './types.ts';

export interface RawRecord {
  /** 1-based physical line where the record starts. */
  line: number;
  cells: string[];
}

function isCsvError(error: unknown): error is Error & { code: string } {
  // csv-parse's CsvError; matched by its code because the sync and main entry points can load
  // different copies of the class (ESM and CommonJS builds).
  const code = (error as { code?: unknown } | null)?.code;
  return error instanceof Error && typeof code === 'string' && code.startsWith('CSV_');
}

function parseCells(text: string, delimiter: Delimiter, onRecord?: (lines: number) => void): string[][] {
  return parse(text, {
    delimiter,
    record_delimiter: '\n',
    relax_column_count: true,
    relax_quotes: true,
    skip_empty_lines: false,
    ...(onRecord ? { on_record: (cells: string[], context: { lines: number }) => (onRecord(context.lines), cells) } : {}),
  }) as string[][];
}

/** The line on which the record that csv-parse choked on starts (a slower second pass). */
function failingRecordLine(text: string, delimiter: Delimiter, fromLine: number): number {
  let next = fromLine;
  try {
    parseCells(text, delimiter, (lines) => (next = fromLine + lines));
  } catch {
    // expected: the same error again
  }
  return next;
}

/** Where line `line` (1-based) starts in `text`. */
function lineStart(text: string, line: number): number {
  let at = 0;
  for (let n = 1; n < line; n += 1) at = text.indexOf('\n', at) + 1;
  return at;
}

/**
 * Records from line `fromLine` on. The lines above it (a preamble) are cut off before csv-parse
 * sees them, so a stray quote there cannot swallow the header. `text` must use "\n" line ends
 * only (see normaliseLineEnds).
 */
export function readRecords(fullText: string, delimiter: Delimiter, fromLine: number): RawRecord[] {
  const text = fromLine > 1 ? fullText.slice(lineStart(fullText, fromLine)) : fullText;
  let rows: string[][];
  try {
    rows = parseCells(text, delimiter);
  } catch (error) {
    if (!isCsvError(error)) throw error;
    const line = failingRecordLine(text, delimiter, fromLine);
    const message =
      error.code === 'CSV_QUOTE_NOT_CLOSED'
        ? `A quote (") opened in the record starting on line ${line} is never closed.`
        : `The file cannot be split into cells from line ${line} on: ${error.message}`;
    throw layoutError('malformed_csv', message, { line });
  }
  // A record spans more than one line only through line breaks inside quoted cells, and those
  // stay in the cell text: counting them gives each record's first line without csv-parse's
  // per-record info objects (a third of its time on large files).
  const quoted = text.indexOf('"') >= 0;
  const records: RawRecord[] = new Array(rows.length);
  let line = fromLine;
  for (let i = 0; i < rows.length; i += 1) {
    const cells = rows[i];
    records[i] = { line, cells };
    line += 1;
    if (!quoted) continue;
    for (const cell of cells) {
      for (let at = cell.indexOf('\n'); at >= 0; at = cell.indexOf('\n', at + 1)) line += 1;
    }
  }
  return records;
}

export function isBlankRecord(cells: string[]): boolean {
  for (const cell of cells) if (cell.trim() !== '') return false;
  return true;
}

/** "\r\n" and a lone "\r" become "\n", so csv-parse's line count matches the file's lines. */
export function normaliseLineEnds(text: string): string {
  return text.indexOf('\r') < 0 ? text : text.replace(/\r\n?/g, '\n');
}
