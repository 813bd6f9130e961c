import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decimalsOf, roundDown, roundHalfEven, roundUp } from '../../../server/domain/chemistry/rounding.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

/**
 * Independent oracle for half-even rounding: integer arithmetic on the digits with BigInt
 * (no decimal.js, no floats). Only for plain decimal strings and decimals ≥ 0.
 */
function bigIntHalfEven(value: string, decimals: number): string {
  const negative = value.startsWith('-');
  const [integer, fraction = ''] = value.replace(/^[+-]/, '').split('.');
  const scale = Math.max(fraction.length, decimals);
  const scaled = BigInt(integer + fraction.padEnd(scale, '0'));
  const divisor = 10n ** BigInt(scale - decimals);
  let quotient = scaled / divisor;
  const twice = 2n * (scaled % divisor);
  if (twice > divisor || (twice === divisor && quotient % 2n === 1n)) quotient += 1n;
  const digits = quotient.toString().padStart(decimals + 1, '0');
  const text = decimals === 0 ? digits : `${digits.slice(0, -decimals)}.${digits.slice(-decimals)}`;
  return negative && quotient !== 0n ? `-${text}` : text;
}

describe('roundHalfEven', () => {
  // ASTM E29 / ISO 80000-1 Annex B rule A pairs, as listed (and checked with decimal.js) in
  // docs/references.md#rounding.
  it.each([
    ['56.748', 1, '56.7'],
    ['2.146', 2, '2.15'],
    ['21.4501', 1, '21.5'],
    ['21.350', 1, '21.4'],
    ['21.45', 1, '21.4'],
    ['42.85', 1, '42.8'],
    ['42.35', 1, '42.4'],
    ['12.25', 1, '12.2'],
    ['12.35', 1, '12.4'],
    ['12.45', 1, '12.4'],
  ])('ASTM E29: %s at %i decimals → %s', (value, decimals, expected) => {
    expect(roundHalfEven(value, decimals)).toBe(expected);
  });

  it('does not fall into the toFixed traps (JavaScript floats)', () => {
    // The traps are real in this runtime: binary 12.35 is 12.3499…, binary 42.85 is 42.850000…01.
    expect((12.35).toFixed(1)).toBe('12.3');
    expect((42.85).toFixed(1)).toBe('42.9');
    // Half-even on the decimal value (ASTM E29): 12.35 → 12.4, 42.85 → 42.8.
    expect(roundHalfEven('12.35', 1)).toBe('12.4');
    expect(roundHalfEven('42.85', 1)).toBe('42.8');
    // 1.005 is 1.00499… in binary; half-even on the decimal gives 1.00 (0 is even), 1.015 → 1.02.
    expect(roundHalfEven('1.005', 2)).toBe('1.00');
    expect(roundHalfEven('1.015', 2)).toBe('1.02');
  });

  it('keeps trailing zeros at the requested decimals', () => {
    expect(roundHalfEven('0.7', 2)).toBe('0.70');
    expect(roundHalfEven('18', 1)).toBe('18.0');
    expect(roundHalfEven('0.0004999', 4)).toBe('0.0005');
    expect(roundHalfEven('0.00005', 4)).toBe('0.0000'); // tie, 0 is even
    expect(roundHalfEven('0.00015', 4)).toBe('0.0002'); // tie, 1 is odd → 2
  });

  it('decides a tie only when the rest is exactly zero (one-step rounding, ASTM E29)', () => {
    expect(roundHalfEven('0.12500000000000000000000000000001', 2)).toBe('0.13');
    expect(roundHalfEven('0.125', 2)).toBe('0.12');
    // In two steps 0.12549 → 0.125 → 0.12 (a tie created by the first step); ASTM E29 rounds once
    // from the full value: 0.12549 is above 0.125, so 0.13.
    expect(roundHalfEven(roundHalfEven('0.12549', 3), 2)).toBe('0.12');
    expect(roundHalfEven('0.12549', 2)).toBe('0.13');
  });

  it('carries through nines and writes no "-0"', () => {
    expect(roundHalfEven('9.96', 1)).toBe('10.0');
    expect(roundHalfEven('99.95', 1)).toBe('100.0');
    expect(roundHalfEven('-0.004', 2)).toBe('0.00');
    expect(roundHalfEven('-1.25', 1)).toBe('-1.2');
    expect(roundHalfEven('-1.35', 1)).toBe('-1.4');
  });

  it('handles exponent notation through decimal.js', () => {
    expect(roundHalfEven('1.25e-3', 4)).toBe('0.0012');
    expect(roundHalfEven('1.35e-3', 4)).toBe('0.0014');
  });

  it('rounds to tens and hundreds with negative decimals (ISO 80000-1 rule A)', () => {
    expect(roundHalfEven('650', -2)).toBe('600');
    expect(roundHalfEven('750', -2)).toBe('800');
    expect(roundHalfEven('749.99', -2)).toBe('700');
    expect(roundHalfEven('725', -1)).toBe('720');
    // Just above a tie: decimal.js at its default 20 digits would see 6.5 and round to 600.
    expect(roundHalfEven('650.0000000000000000000001', -2)).toBe('700');
    expect(roundUp('600.0000000000000000000001', -2)).toBe('700');
  });

  it('refuses a non-integer number of decimals', () => {
    expect(() => roundHalfEven('1.5', 1.5)).toThrow(RangeError);
    expect(() => roundHalfEven('abc', 1)).toThrow();
  });

  it('agrees with integer arithmetic on random decimals (property, BigInt oracle)', () => {
    const decimal = decimalString({ maxDigits: 10n ** 40n, maxScale: 35, signs: ['', '-'] });
    fc.assert(
      fc.property(decimal, fc.integer({ min: 0, max: 12 }), (value, decimals) => {
        expect(roundHalfEven(value, decimals)).toBe(bigIntHalfEven(value, decimals));
      }),
      { numRuns: 3000 },
    );
  });

  it('agrees with the oracle on constructed ties (property)', () => {
    // k digits, then exactly "5": every one of these is a tie at k decimals.
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10 ** 9 }), fc.integer({ min: 0, max: 6 }), (digits, decimals) => {
        const kept = String(digits).padStart(decimals + 1, '0');
        const value = `${kept.slice(0, kept.length - decimals)}.${kept.slice(kept.length - decimals)}5`;
        const expected = bigIntHalfEven(value, decimals);
        expect(roundHalfEven(value, decimals)).toBe(expected);
        expect(Number(expected.at(-1)) % 2).toBe(0); // a tie always ends on an even digit
      }),
      { numRuns: 1000 },
    );
  });
});

describe('roundUp / roundDown (bounds stay true)', () => {
  it('rounds a "<" bound up and a ">" bound down', () => {
    expect(roundUp('0.00045', 3)).toBe('0.001');
    expect(roundUp('0.0010', 3)).toBe('0.001');
    expect(roundUp('0.0005', 4)).toBe('0.0005');
    expect(roundDown('1.4567', 2)).toBe('1.45');
    expect(roundDown('1.5', 2)).toBe('1.50');
  });
});

describe('decimalsOf', () => {
  it('counts the written decimals of a limit, trailing zeros included (ASTM E29)', () => {
    expect(decimalsOf('0.40')).toBe(2);
    expect(decimalsOf('0.8')).toBe(1);
    expect(decimalsOf('18.0')).toBe(1);
    expect(decimalsOf('0.050')).toBe(3);
    expect(decimalsOf('2')).toBe(0);
    expect(decimalsOf(' 0.15 ')).toBe(2);
  });

  it('refuses what is not a plain decimal', () => {
    expect(() => decimalsOf('4.0e-1')).toThrow(RangeError);
    expect(() => decimalsOf('abc')).toThrow(RangeError);
    expect(() => decimalsOf('')).toThrow(RangeError);
  });
});
