// One element cell → a value in % as an exact decimal string. Plain numbers in % (nearly every
// cell) take a string-only fast path; everything else goes through readMassFraction, the rule
// every way in shares (values above 100 % and negative values are refused there).
import { readMassFraction } from '../../chemistry/mass-fraction.ts';
import { MeasuredValueError } from '../../chemistry/measured-value.ts';
import type { Unit } from '../../chemistry/units.ts';
import { SAMPLE_TEXT_LIMITS } from '../../samples/sample-limits.ts';
import type { DecimalSeparator, ParsedValue } from './types.ts';

export class CellError extends Error {}

const PLAIN_DOT = /^\d+(\.\d+)?$/;
const PLAIN_COMMA = /^\d+(,\d+)?$/;

/** "007.500" → "7.5", "0.000" → "0": the same text as decimal.js's toFixed(). */
export function normalisePlainDecimal(digits: string, separatorAt: number): string {
  const last = digits.charCodeAt(digits.length - 1);
  // Most cells are already canonical ("0.172"): return them without building new strings.
  if (digits.charCodeAt(0) !== 48 || digits.length === 1 || digits.charCodeAt(1) === 46) {
    if (separatorAt < 0 || (last !== 48 && digits.charCodeAt(separatorAt) === 46)) return digits;
  }
  let intPart = separatorAt < 0 ? digits : digits.slice(0, separatorAt);
  let fraction = separatorAt < 0 ? '' : digits.slice(separatorAt + 1);
  let start = 0;
  while (start < intPart.length - 1 && intPart.charCodeAt(start) === 48) start += 1;
  intPart = intPart.slice(start);
  let end = fraction.length;
  while (end > 0 && fraction.charCodeAt(end - 1) === 48) end -= 1;
  fraction = fraction.slice(0, end);
  return fraction ? `${intPart}.${fraction}` : intPart;
}

function plainPercent(text: string, separator: DecimalSeparator): string {
  const value = normalisePlainDecimal(text, text.indexOf(separator));
  const dot = value.indexOf('.');
  const intPart = dot < 0 ? value : value.slice(0, dot);
  // Trailing zeros are gone, so "100" followed by a fraction is above 100.
  if (intPart.length > 3 || (intPart.length === 3 && (intPart > '100' || dot >= 0))) throw new CellError(`${value} % is above 100 %`);
  return value;
}

/** Reads a cell; null for a blank cell (not measured). Throws CellError for a broken value. */
export function readCell(raw: string, decimalSeparator: DecimalSeparator, unit: Unit): ParsedValue | null {
  const text = raw.trim();
  if (text === '') return null;
  // The cell is kept as written (raw), so it obeys the limit of a value pushed as text.
  if (raw.length > SAMPLE_TEXT_LIMITS.value)
    throw new CellError(`the cell has ${raw.length} characters, at most ${SAMPLE_TEXT_LIMITS.value} are accepted`);
  if (unit === '%' && (decimalSeparator === '.' ? PLAIN_DOT : PLAIN_COMMA).test(text)) {
    return { value: plainPercent(text, decimalSeparator), qualifier: null, raw, unit };
  }
  try {
    const read = readMassFraction(text, unit, decimalSeparator);
    return read && { ...read, raw, unit };
  } catch (error) {
    if (error instanceof MeasuredValueError) throw new CellError(error.message);
    throw error;
  }
}
