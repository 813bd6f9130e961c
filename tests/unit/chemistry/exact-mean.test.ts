import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decimalMean, exactMean, scaledQuotient, toScaledIntegers } from '../../../server/domain/chemistry/exact-mean.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

// Oracle: decimal.js 10.6.0 configured here, independently of the module: 34 significant digits
// (IEEE 754 decimal128), half-even, plain notation.
const Decimal34 = Decimal.clone({ precision: 34, rounding: Decimal.ROUND_HALF_EVEN });
const Decimal100 = Decimal.clone({ precision: 100 });
function oracleMean(values: string[]): string {
  const sum = values.reduce((total, value) => total.plus(value), new Decimal34(0));
  const mean = sum.div(values.length);
  return mean.isZero() ? '0' : mean.toFixed();
}

const signed = (maxDigits: bigint, maxScale: number) => decimalString({ maxDigits, maxScale, signs: ['', '', '-', '+'] });

describe('exactMean', () => {
  it('equals decimal.js at 34 digits on instrument-like values (property, integer path)', () => {
    fc.assert(
      fc.property(fc.array(signed(10n ** 8n, 6), { minLength: 1, maxLength: 25 }), (values) => {
        expect(toScaledIntegers(values)).toBeDefined(); // these must take the fast path
        expect(exactMean(values)).toBe(oracleMean(values));
      }),
      { numRuns: 3000 },
    );
  });

  it('equals decimal.js on long and wide values (property, both paths)', () => {
    fc.assert(
      fc.property(fc.array(signed(10n ** 22n, 20), { minLength: 1, maxLength: 40 }), (values) => {
        expect(exactMean(values)).toBe(oracleMean(values));
        expect(decimalMean(values)).toBe(oracleMean(values));
      }),
      { numRuns: 3000 },
    );
  });

  it('handles many values, where the quotient has long periods', () => {
    const values = Array.from({ length: 997 }, (_, i) => (i % 7 === 0 ? '0.0013' : '12.4471'));
    expect(exactMean(values)).toBe(oracleMean(values));
  });

  it('leaves the integer path when digits reach 2^53 (exactness of doubles)', () => {
    expect(toScaledIntegers(['9007199254740991'])).toBeDefined(); // 2^53 − 1
    expect(toScaledIntegers(['9007199254740992'])).toBeUndefined(); // 2^53
    expect(toScaledIntegers(['4503599627370496', '4503599627370496'])).toBeUndefined(); // sum 2^53
    expect(exactMean(['9007199254740993', '1'])).toBe('4503599627370497');
    expect(toScaledIntegers(['1.5', 'abc'])).toBeUndefined();
    expect(toScaledIntegers(['1.2.3'])).toBeUndefined();
    expect(() => exactMean(['1.5', 'abc'])).toThrow();
  });

  it('breaks a tie at the 35th significant digit to even (decimal.js oracle)', () => {
    // An odd 16-digit sum over n = 2^27 is exactly sum·5^27 / 10^27: 35 digits ending in 5.
    const n = 2 ** 27;
    for (const sum of [9007199254740991, 9007199254740989, 9007199254740987, -9007199254740985]) {
      const expected = new Decimal34(sum).div(n);
      expect(new Decimal100(sum).div(n).precision()).toBe(35); // really a tie at 34 digits
      expect(new Decimal100(sum).div(n).toFixed().endsWith('5')).toBe(true);
      expect(scaledQuotient(sum, n, 0)).toBe(expected.toFixed());
    }
    expect(scaledQuotient(725, 1, 2)).toBe('7.25');
    expect(scaledQuotient(0, 3, 2)).toBe('0');
  });

  it('scales values to a common number of decimals', () => {
    expect(toScaledIntegers(['0.752', '1.1', '-2'])).toEqual({ integers: [752, 1100, -2000], sum: -148, scale: 3 });
  });
});
