// Wide layout: one row is one burn, one column per element. A row with any broken cell is
// rejected as a whole (every broken cell is reported) and keeps its burn number, so the
// numbers of the following burns do not shift.
import { CellError, readCell } from './cell-value.ts';
import type { RawRecord } from './read-records.ts';
import { enterRow, isIssue, readBurnNumber, readTime, type RowReading } from './row-cells.ts';
import type { Issue, ParsedValue } from './types.ts';

export function readWideRow(record: RawRecord, reading: RowReading): void {
  const entered = enterRow(record, reading);
  if (!entered) return;
  const { identity, state } = entered;
  const { line, cells } = record;
  const { columns, grouper } = reading;
  const issues: Issue[] = [];

  const written = readBurnNumber(cells, line, columns);
  let burnNumber: number;
  if (isIssue(written)) {
    issues.push(written);
    burnNumber = state.nextBurn;
  } else if (written !== undefined && state.burns.has(written)) {
    issues.push({
      line,
      column: columns.burnNumber!.header,
      code: 'duplicate_burn',
      message: `Burn ${written} of sample ${identity.sample_code} appears twice (lines ${state.burns.get(written)!.line} and ${line}).`,
    });
    burnNumber = written;
  } else burnNumber = written ?? state.nextBurn;
  state.nextBurn = Math.max(state.nextBurn, burnNumber + 1);

  const time = readTime(cells, line, columns, reading.time);
  if (isIssue(time)) issues.push(time);

  const values: Record<string, ParsedValue> = {};
  let count = 0;
  for (const column of reading.elements) {
    try {
      const value = readCell(cells[column.index], reading.decimal, column.unit!);
      if (value) {
        values[column.element!] = value;
        count += 1;
      }
    } catch (error) {
      if (!(error instanceof CellError)) throw error;
      issues.push({ line, column: column.header, code: 'invalid_value', message: `Line ${line}, ${column.header}: ${error.message}.` });
    }
  }
  if (issues.length > 0) return grouper.reject(issues, state);
  if (count === 0) {
    reading.warnings.push({ line, code: 'empty_burn', message: `Line ${line} holds no element values; it is skipped.` });
    return;
  }
  state.burns.set(burnNumber, { line, burn_number: burnNumber, ...(typeof time === 'string' ? { measured_at: time } : {}), values });
}
