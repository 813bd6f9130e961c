// fast-check generator of plain decimal strings ("-0.00725", "+12", "3.10"), written from an
// integer and a scale so that every digit is exact — no binary float ever touches the value.
import fc from 'fast-check';

export interface DecimalStringOptions {
  /** Largest integer of digits (the value is digits × 10^−scale). */
  maxDigits: bigint;
  maxScale: number;
  /** Signs to draw from; repeat '' to make unsigned values more frequent. */
  signs?: string[];
}

export function decimalString({ maxDigits, maxScale, signs = [''] }: DecimalStringOptions): fc.Arbitrary<string> {
  return fc
    .tuple(fc.constantFrom(...signs), fc.bigInt({ min: 0n, max: maxDigits }), fc.integer({ min: 0, max: maxScale }))
    .map(([sign, digits, scale]) => {
      const text = digits.toString().padStart(scale + 1, '0');
      return sign + (scale === 0 ? text : `${text.slice(0, -scale)}.${text.slice(-scale)}`);
    });
}
