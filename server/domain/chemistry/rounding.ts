// Rounding of chemistry values for reporting and conformance (ASTM E29 rounding method;
// ISO 80000-1 Annex B, rule A): round in ONE step from the full decimal value to the last
// place given, and when the discarded part is exactly one half, keep the last retained digit
// even. Values are decimal strings and are rounded on their decimal digits — directly for plain
// decimals, with decimal.js otherwise — never through a binary float, which cannot hold 12.35 or
// 42.85 exactly: `(12.35).toFixed(1)` gives "12.3" and `(42.85).toFixed(1)` "42.9".
import { Decimal } from 'decimal.js';

/** Division by 10^k must not round (decimal.js rounds quotients to 20 digits by default). */
const Exact = Decimal.clone({ precision: 1000 });

const PLAIN_DECIMAL = /^[+-]?(\d+(\.\d*)?|\.\d+)$/;

function checkDecimals(decimals: number): void {
  if (!Number.isInteger(decimals) || Math.abs(decimals) > 20) {
    throw new RangeError(`decimals must be an integer between -20 and 20, got ${decimals}`);
  }
}

/** Writes a rounded value with exactly `decimals` places (none when decimals ≤ 0), never "-0". */
function format(rounded: Decimal, decimals: number): string {
  const text = rounded.toFixed(Math.max(0, decimals));
  return rounded.isZero() ? text.replace(/^-/, '') : text;
}

/** Rounds `value` to `decimals` places, direction fixed by `mode` (a decimal.js rounding mode). */
function roundWith(value: string, decimals: number, mode: Decimal.Rounding): string {
  checkDecimals(decimals);
  const exact = new Exact(value); // the constructor keeps every digit; it does not round
  if (decimals >= 0) return format(exact.toDecimalPlaces(decimals, mode), decimals);
  // Negative decimals round to tens, hundreds … (0.07 % = 700 ppm reported in steps of 100 ppm).
  const step = new Exact(10).pow(-decimals);
  return format(exact.div(step).toDecimalPlaces(0, mode).mul(step), decimals);
}

/**
 * Rounds a decimal string half to even at `decimals` places and keeps trailing zeros:
 * roundHalfEven("0.7", 2) = "0.70", roundHalfEven("12.35", 1) = "12.4", roundHalfEven("12.25", 1) = "12.2".
 * Negative `decimals` round to tens (-1), hundreds (-2) …
 */
export function roundHalfEven(value: string, decimals: number): string {
  checkDecimals(decimals);
  return (decimals >= 0 && roundPlainHalfEven(value, decimals)) || roundWith(value, decimals, Decimal.ROUND_HALF_EVEN);
}

/**
 * The same rule on the digits of a plain decimal ("-12.3456"), without decimal.js: reporting a
 * mean is on the ingest hot path and parsing a 34-digit mean into a Decimal costs ~1 µs. Keep
 * the digits up to the place, look at the rest: more than half → up, less → down, exactly half
 * ("5" then only zeros) → up only if the last kept digit is odd. Undefined for other notations.
 * tests/unit/chemistry/rounding.test.ts checks it against BigInt arithmetic on random decimals.
 */
function roundPlainHalfEven(value: string, decimals: number): string | undefined {
  const match = SIGNED_PLAIN.exec(value);
  if (!match) return undefined;
  const [, sign, integer, fraction = ''] = match;
  if (fraction.length <= decimals) return withSign(sign, integer, fraction.padEnd(decimals, '0'));
  let kept = integer + fraction.slice(0, decimals);
  const first = fraction.charCodeAt(decimals) - 48;
  const rest = fraction.slice(decimals + 1);
  const odd = (kept.charCodeAt(kept.length - 1) - 48) % 2 === 1;
  if (first > 5 || (first === 5 && (NON_ZERO.test(rest) || odd))) kept = incrementDigits(kept);
  const integerLength = kept.length - decimals;
  return withSign(sign, kept.slice(0, integerLength), kept.slice(integerLength));
}

const SIGNED_PLAIN = /^([+-]?)(\d+)(?:\.(\d*))?$/;
const NON_ZERO = /[1-9]/;

/** "1299" → "1300", "99" → "100". */
function incrementDigits(digits: string): string {
  let i = digits.length - 1;
  while (i >= 0 && digits[i] === '9') i--;
  if (i < 0) return `1${'0'.repeat(digits.length)}`;
  return digits.slice(0, i) + String.fromCharCode(digits.charCodeAt(i) + 1) + '0'.repeat(digits.length - i - 1);
}

/** Joins sign, integer and fraction; drops leading zeros and the sign of zero. */
function withSign(sign: string, integer: string, fraction: string): string {
  const whole = integer.replace(LEADING_ZEROS, '') || '0';
  const text = fraction === '' ? whole : `${whole}.${fraction}`;
  const isZero = whole === '0' && !NON_ZERO.test(fraction);
  return sign === '-' && !isZero ? `-${text}` : text;
}

const LEADING_ZEROS = /^0+/;

/**
 * Rounds toward +∞ ("< 0.00045" at 3 decimals must read "< 0.001", not "< 0.000"): used for the
 * bound of a "<" result so that the written statement stays true.
 */
export function roundUp(value: string, decimals: number): string {
  return roundWith(value, decimals, Decimal.ROUND_CEIL);
}

/** Rounds toward −∞: the bound of a ">" result stays true when written with fewer places. */
export function roundDown(value: string, decimals: number): string {
  return roundWith(value, decimals, Decimal.ROUND_FLOOR);
}

/**
 * The decimals a limit is written with: "0.40" → 2, "0.8" → 1, "18.0" → 1, "2" → 0. ASTM E29
 * compares a result rounded to the last place of the limit as written, so trailing zeros count
 * and the limit must stay a string (a number would lose them). Exponent notation is refused:
 * "4.0e-1" does not say which place was meant.
 */
export function decimalsOf(limit: string): number {
  const text = limit.trim();
  if (!PLAIN_DECIMAL.test(text)) throw new RangeError(`"${limit}" is not a plain decimal number`);
  const point = text.indexOf('.');
  return point === -1 ? 0 : text.length - point - 1;
}
