// One cell of chemistry as an instrument or integrator writes it. "<0.0005" and ">1.5" are
// qualified values (below / above what the instrument can report), "n.d." means not detected,
// and a blank cell means "not measured" — none of them is an error.
import { Decimal } from 'decimal.js';

export type Qualifier = '<' | '>' | 'nd';

export type MeasuredValue =
  | { kind: 'value'; value: string; qualifier: null }
  | { kind: 'qualified'; value: string; qualifier: '<' | '>' }
  | { kind: 'not_detected'; value: null; qualifier: 'nd' }
  | { kind: 'blank' };

export class MeasuredValueError extends Error {}

const NOT_DETECTED = new Set(['n.d.', 'nd', 'n.d', 'not detected', 'bdl']);
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Parses one cell. `decimalSeparator` "," accepts "0,75" (and refuses "." so that
 * "1.234" is never silently read as one thousand two hundred thirty-four).
 */
export function parseMeasuredValue(raw: string | number | null | undefined, decimalSeparator: '.' | ',' = '.'): MeasuredValue {
  if (raw === null || raw === undefined) return { kind: 'blank' };
  if (typeof raw === 'number') {
    if (!Number.isFinite(raw)) throw new MeasuredValueError('is not a finite number');
    return checked({ kind: 'value', value: plain(raw), qualifier: null });
  }
  const text = raw.trim();
  if (text === '') return { kind: 'blank' };
  if (NOT_DETECTED.has(text.toLowerCase())) return { kind: 'not_detected', value: null, qualifier: 'nd' };
  const qualifier = text[0] === '<' || text[0] === '>' ? text[0] : null;
  let number = (qualifier ? text.slice(1) : text).trim();
  if (decimalSeparator === ',') {
    if (number.includes('.')) throw new MeasuredValueError(`"${text}" uses "." but this layout's decimal separator is ","`);
    number = number.replace(',', '.');
  }
  if (!NUMBER.test(number)) throw new MeasuredValueError(`"${text}" is not a number, a qualified value such as "<0.001" or "n.d."`);
  const value = plain(number);
  return checked(qualifier ? { kind: 'qualified', value, qualifier } : { kind: 'value', value, qualifier: null });
}

function checked<T extends MeasuredValue>(parsed: T): T {
  if ('value' in parsed && parsed.value !== null && new Decimal(parsed.value).isNegative() && !new Decimal(parsed.value).isZero()) {
    throw new MeasuredValueError(`${parsed.value} is negative; a mass fraction cannot be`);
  }
  return parsed;
}

/**
 * Plain notation ("0.00000005", never "5e-8"), trailing zeros dropped, "-0" written "0". The
 * exponent is checked first, so "1e999999999" is refused instead of written out in full: beyond
 * 10^10 a value is above 100 % in every unit, below 10^-30 it is no measurement.
 */
function plain(number: string | number): string {
  const value = new Decimal(number);
  if (value.isZero()) return '0';
  if (value.e > 10) throw new MeasuredValueError(`${String(number)} is above 100 % in any unit`);
  if (value.e < -30) throw new MeasuredValueError(`${String(number)} is too small to be a measured value`);
  return value.toFixed();
}
