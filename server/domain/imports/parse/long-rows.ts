// Long layout: one row is one element value. Burns come from the burn column; without one, a
// burn is open until an element repeats or the time changes, then the next burn begins.
import { normaliseElement } from '../../chemistry/elements.ts';
import { parseUnit, type Unit } from '../../chemistry/units.ts';
import { CellError, readCell } from './cell-value.ts';
import type { SampleState } from './grouping.ts';
import type { RawRecord } from './read-records.ts';
import { enterRow, isIssue, readBurnNumber, readTime, type RowReading } from './row-cells.ts';
import type { ColumnRole, Issue, ParsedBurn, ParsedValue } from './types.ts';

export interface LongColumns {
  element: ColumnRole;
  value: ColumnRole;
  unit?: ColumnRole;
}

function readUnit(cells: string[], line: number, long: LongColumns): Unit | Issue {
  const text = long.unit ? cells[long.unit.index]?.trim() : '';
  if (!text) return long.value.unit!;
  return (
    parseUnit(text) ?? {
      line,
      column: long.unit!.header,
      code: 'unknown_unit',
      message: `"${text}" on line ${line} is not a mass-fraction unit (%, ppm, mg/kg, ppb, µg/kg).`,
    }
  );
}

function readElement(cells: string[], line: number, long: LongColumns): string | Issue {
  const text = cells[long.element.index]?.trim() ?? '';
  const element = normaliseElement(text);
  if (element) return element;
  return text === ''
    ? { line, column: long.element.header, code: 'missing_element', message: `Line ${line} names no element.` }
    : { line, column: long.element.header, code: 'unknown_element', message: `"${text}" on line ${line} is not an element symbol.` };
}

function burnFor(state: SampleState, written: number | undefined, element: string, time: string | undefined, line: number): ParsedBurn {
  if (written !== undefined) {
    let burn = state.burns.get(written);
    if (!burn) {
      burn = { line, burn_number: written, values: {} };
      state.burns.set(written, burn);
      state.nextBurn = Math.max(state.nextBurn, written + 1);
    }
    return burn;
  }
  const open = state.openBurn;
  if (open && !(element in open.values) && (time === undefined || open.measured_at === undefined || open.measured_at === time)) return open;
  const burn: ParsedBurn = { line, burn_number: state.nextBurn, values: {} };
  state.burns.set(burn.burn_number, burn);
  state.nextBurn += 1;
  state.openBurn = burn;
  return burn;
}

export function readLongRow(record: RawRecord, reading: RowReading, long: LongColumns): void {
  const entered = enterRow(record, reading);
  if (!entered) return;
  const { identity, state } = entered;
  const { line, cells } = record;
  const { columns, grouper } = reading;

  const element = readElement(cells, line, long);
  const unit = readUnit(cells, line, long);
  const written = readBurnNumber(cells, line, columns);
  const time = readTime(cells, line, columns, reading.time);
  const issues = [element, unit, written, time].filter(isIssue);
  let value: ParsedValue | null = null;
  if (!isIssue(unit)) {
    try {
      value = readCell(cells[long.value.index] ?? '', reading.decimal, unit);
    } catch (error) {
      if (!(error instanceof CellError)) throw error;
      issues.push({
        line,
        column: long.value.header,
        code: 'invalid_value',
        message: `Line ${line}, ${long.value.header}: ${error.message}.`,
      });
    }
  }
  if (issues.length > 0) return grouper.reject(issues, state);
  if (!value) return; // blank: not measured
  const symbol = element as string;
  const burn = burnFor(state, written as number | undefined, symbol, time as string | undefined, line);
  if (symbol in burn.values) {
    return grouper.reject(
      [
        {
          line,
          column: long.element.header,
          code: 'duplicate_value',
          message: `Burn ${burn.burn_number} of sample ${identity.sample_code} has ${symbol} twice (line ${line}).`,
        },
      ],
      state,
    );
  }
  if (time !== undefined) {
    if (burn.measured_at === undefined) burn.measured_at = time as string;
    else if (burn.measured_at !== time) {
      reading.warnings.push({
        line,
        column: columns.measuredAt!.header,
        code: 'time_mismatch',
        message: `Line ${line} gives another time than the burn's first line (${burn.line}); the first is kept.`,
      });
    }
  }
  burn.values[symbol] = value;
}
