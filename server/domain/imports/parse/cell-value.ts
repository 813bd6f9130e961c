// One element cell → a value in % as an exact decimal string. Plain numbers (nearly every
// cell) take a string-only fast path; everything else goes through parseMeasuredValue and
// decimal.js. Values above 100 % cannot be mass fractions and are refused, which also keeps
// absurd exponents ("1e999999") from expanding into huge strings.
import { Decimal } from 'decimal.js';
import { MeasuredValueError, parseMeasuredValue } from '../../chemistry/measured-value.ts';
import { toPercent, type Unit } from '../../chemistry/units.ts';
import { SAMPLE_TEXT_LIMITS } from '../../samples/sample-limits.ts';
import type { DecimalSeparator, ParsedValue } from './types.ts';

export class CellError extends Error {}

const PLAIN_DOT = /^\d+(\.\d+)?$/;
const PLAIN_COMMA = /^\d+(,\d+)?$/;
const HUNDRED = new Decimal(100);

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
  if (intPart.length > 3 || (intPart.length === 3 && (intPart > '100' || dot >= 0))) throw new CellError(`${text} % is above 100 %`);
  return value;
}

function inPercent(value: string, unit: Unit): string {
  const decimal = new Decimal(value);
  // Anything beyond 1e10 in any unit is over 100 %; tiny exponents would print as long zeros.
  if (decimal.e > 10) throw new CellError(`${value} ${unit} is above 100 %`);
  if (!decimal.isZero() && decimal.e < -30) throw new CellError(`${value} is too small to be a measured value`);
  const percent = toPercent(decimal.toFixed(), unit);
  if (new Decimal(percent).gt(HUNDRED)) throw new CellError(`${value} ${unit} is above 100 %`);
  return percent;
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
  let parsed;
  try {
    parsed = parseMeasuredValue(text, decimalSeparator);
  } catch (error) {
    if (error instanceof MeasuredValueError) throw new CellError(error.message);
    throw error;
  }
  switch (parsed.kind) {
    case 'blank':
      return null;
    case 'not_detected':
      return { value: null, qualifier: 'nd', raw, unit };
    default:
      return { value: inPercent(parsed.value, unit), qualifier: parsed.qualifier, raw, unit };
  }
}
