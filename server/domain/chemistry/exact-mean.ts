// The exact mean of decimal strings, correctly rounded (half to even) to 34 significant digits —
// the precision of IEEE 754 decimal128. The mean is what gets rounded for reporting and compared
// with grade limits, so it must be exact: the mean of "12.3" and "12.4" is "12.35" (which ASTM E29
// rounds to "12.4"), where binary floats give 12.349999999999999 (→ "12.3").
//
// Why 34 digits are enough: instrument values have at most ~15 significant digits, so their sum
// is exact; an exact tie at any reporting place is a short terminating decimal and is represented
// exactly, and a non-terminating quotient cannot be rounded onto a tie.
//
// Speed: decimal.js spends ~1 µs on each 34-digit division, which dominated the ingest of
// 500 000 values. Plain decimal strings whose scaled digits fit a double's safe-integer range
// (2^53, i.e. every realistic instrument value) are therefore summed as exact integers and divided
// with BigInt; anything else (exponents, very long values) goes through decimal.js.
// A property test checks that both paths give identical strings.
import { Decimal } from 'decimal.js';

const SIGNIFICANT_DIGITS = 34;
const MeanDecimal = Decimal.clone({ precision: SIGNIFICANT_DIGITS, rounding: Decimal.ROUND_HALF_EVEN });

/** Values written as integers × 10^−scale: "0.752", "1.1" → [752, 1100] with scale 3. */
export interface ScaledValues {
  integers: number[];
  /** Σ integers, exact (a safe integer). */
  sum: number;
  scale: number;
}

/** The exact mean as a plain decimal string ("12.35", "0.0000001", never "1e-7" or "-0"). */
export function exactMean(values: readonly string[]): string {
  if (values.length === 0) throw new RangeError('the mean of no values is undefined');
  const scaled = toScaledIntegers(values);
  return scaled ? meanOfScaled(scaled) : decimalMean(values);
}

/** Reference path: decimal.js at 34 significant digits, half to even. */
export function decimalMean(values: readonly string[]): string {
  let sum = new MeanDecimal(0);
  for (const value of values) sum = sum.plus(value);
  const mean = sum.div(values.length);
  return mean.isZero() ? '0' : mean.toFixed();
}

/**
 * The values as exact integers at a common scale, or undefined when one is not a plain decimal
 * or a scaled value or the sum leaves the safe-integer range (then decimal.js takes over).
 */
export function toScaledIntegers(values: readonly string[]): ScaledValues | undefined {
  const n = values.length;
  const integers = new Array<number>(n);
  const decimals = new Array<number>(n);
  let scale = 0;
  for (let i = 0; i < n; i++) {
    if (!parsePlain(values[i], integers, decimals, i)) return undefined;
    if (decimals[i] > scale) scale = decimals[i];
  }
  if (scale > 15) return undefined;
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const integer = integers[i] * 10 ** (scale - decimals[i]);
    if (!Number.isSafeInteger(integer)) return undefined; // exact as long as it stays below 2^53
    integers[i] = integer;
    sum += integer;
    if (!Number.isSafeInteger(sum)) return undefined;
  }
  return { integers, sum, scale };
}

/**
 * Reads "[+-]digits[.digits]" into integers[i] (all digits, signed) and decimals[i] (digits after
 * the point) in one pass over the characters: the ingest hot path, so no regex and no slicing.
 * False for anything else, or when the digits reach 2^53 (a double would no longer be exact).
 */
function parsePlain(value: string, integers: number[], decimals: number[], i: number): boolean {
  let position = 0;
  let negative = false;
  const first = value.charCodeAt(0);
  if (first === 45 || first === 43) {
    // "-" or "+"
    negative = first === 45;
    position = 1;
  }
  let integer = 0;
  let digits = 0;
  let afterPoint = -1;
  for (; position < value.length; position++) {
    const code = value.charCodeAt(position);
    if (code === 46) {
      // "."
      if (afterPoint !== -1) return false;
      afterPoint = 0;
    } else if (code >= 48 && code <= 57) {
      integer = integer * 10 + (code - 48);
      digits += 1;
      if (afterPoint !== -1) afterPoint += 1;
    } else {
      return false;
    }
  }
  if (digits === 0 || !Number.isSafeInteger(integer)) return false;
  integers[i] = negative ? -integer : integer;
  decimals[i] = afterPoint === -1 ? 0 : afterPoint;
  return true;
}

/** The exact mean of scaled values (see exactMean). */
export function meanOfScaled(scaled: ScaledValues): string {
  return scaledQuotient(scaled.sum, scaled.integers.length, scaled.scale);
}

/**
 * (sum / n) / 10^scale for a safe integer `sum`, rounded half-even to 34 significant digits:
 * q = ⌊|sum|·10^k / n⌋ with k chosen so that q has 34 digits, then the remainder decides the
 * rounding (2r > n up, 2r = n a tie → even). A tie at the 35th digit needs n ≥ 2^27 values, but
 * the rule is there and tested.
 */
export function scaledQuotient(sum: number, n: number, scale: number): string {
  if (sum === 0) return '0';
  // Short cut without BigInt: the quotient terminates within three more places (n = 1, 2, 4, 5 …).
  for (let extra = 0, shifted = Math.abs(sum); extra <= 3 && Number.isSafeInteger(shifted); extra++, shifted *= 10) {
    if (shifted % n === 0) return formatScaled(String(shifted / n), scale + extra, sum < 0);
  }
  const dividend = BigInt(Math.abs(sum));
  const divisor = BigInt(n);
  let k = Math.max(0, SIGNIFICANT_DIGITS - (String(Math.abs(sum)).length - String(n).length));
  let quotient = (dividend * POWERS[k]) / divisor;
  let digits = quotient.toString();
  if (digits.length !== SIGNIFICANT_DIGITS && k + SIGNIFICANT_DIGITS - digits.length >= 0) {
    k += SIGNIFICANT_DIGITS - digits.length; // the length estimate can be one digit off
    quotient = (dividend * POWERS[k]) / divisor;
    digits = quotient.toString();
  }
  const twiceRemainder = 2n * (dividend * POWERS[k] - quotient * divisor);
  if (twiceRemainder > divisor || (twiceRemainder === divisor && quotient % 2n === 1n)) {
    digits = (quotient + 1n).toString();
  }
  return formatScaled(digits, k + scale, sum < 0);
}

const POWERS = Array.from({ length: 2 * SIGNIFICANT_DIGITS + 2 }, (_, i) => 10n ** BigInt(i));

/** Writes `digits` × 10^−shift as a plain decimal without trailing zeros ("725", 2 → "7.25"). */
export function formatScaled(digits: string, shift: number, negative: boolean): string {
  const padded = digits.length <= shift ? '0'.repeat(shift - digits.length + 1) + digits : digits;
  const integer = padded.slice(0, padded.length - shift);
  const fraction = padded.slice(padded.length - shift).replace(/0+$/, '');
  const body = fraction === '' ? integer : `${integer}.${fraction}`;
  return negative ? `-${body}` : body;
}
