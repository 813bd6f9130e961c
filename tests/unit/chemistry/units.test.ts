import fc from 'fast-check';
import Qty from 'js-quantities';
import { describe, expect, it } from 'vitest';
import { fromPercent, parseUnit, toPercent } from '../../../server/domain/chemistry/units.ts';
import { decimalString } from '../../helpers/decimal-arbitrary.ts';

describe('mass-fraction conversions (SI brochure; NIST SP 811 §7.10)', () => {
  // SP 811 (docs/references.md#units): 1 % = 0.01 = 10 g/kg = 10 000 mg/kg ("ppm") = 10 000 µg/g;
  // 1 mg/kg = 0.0001 %; 1 µg/kg ("ppb") = 0.0000001 %.
  it('relates %, ppm, ppb and mass fraction exactly', () => {
    expect(fromPercent('1', 'ppm')).toBe('10000');
    expect(fromPercent('1', 'fraction')).toBe('0.01');
    expect(toPercent('1', 'ppm')).toBe('0.0001');
    expect(toPercent('1', 'ppb')).toBe('0.0000001');
    expect(fromPercent('1', 'ppb')).toBe('10000000');
    expect(toPercent('0.01', 'fraction')).toBe('1');
    expect(fromPercent('0.07', 'ppm')).toBe('700');
  });

  it('writes plain notation, never exponents (a stored "1e-7" would surprise every reader)', () => {
    expect(toPercent('0.5', 'ppb')).toBe('0.00000005');
    expect(toPercent('0', 'ppm')).toBe('0');
  });

  it('keeps every digit of a 34-digit mean (decimal.js would round products to 20 digits by default)', () => {
    const mean = '0.7503333333333333333333333333333333';
    expect(fromPercent(mean, 'ppm')).toBe('7503.333333333333333333333333333333');
    expect(toPercent(fromPercent(mean, 'ppb'), 'ppb')).toBe(mean);
  });

  it('round-trips any decimal exactly (property)', () => {
    const decimal = decimalString({ maxDigits: 10n ** 30n, maxScale: 30 });
    fc.assert(
      fc.property(decimal, fc.constantFrom('ppm', 'ppb', 'fraction', '%'), (value, unit) => {
        const canonical = toPercent(value, '%');
        expect(toPercent(fromPercent(value, unit), unit)).toBe(canonical);
      }),
      { numRuns: 1000 },
    );
  });

  it('agrees with js-quantities up to its float noise (property)', () => {
    // js-quantities 1.8.0 knows %, ppm and ppb as dimensionless; it computes with doubles, so
    // 0.07 % → 700.0000000000001 ppm there. We compare within 1e-12 relative.
    expect(Qty('0.07 %').to('ppm').scalar).not.toBe(700);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10 ** 9 }), fc.integer({ min: 0, max: 8 }), (digits, scale) => {
        const percent = (digits / 10 ** scale).toFixed(scale);
        for (const unit of ['ppm', 'ppb'] as const) {
          const theirs = Qty(`${percent} %`).to(unit).scalar;
          const ours = Number(fromPercent(percent, unit));
          expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(1e-12 * Math.abs(theirs));
          expect(Math.abs(Number(toPercent(String(ours), unit)) - Qty(`${ours} ${unit}`).to('%').scalar)).toBeLessThanOrEqual(
            1e-12 * Number(percent),
          );
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe('parseUnit', () => {
  it.each([
    ['%', '%'],
    ['wt%', '%'],
    ['wt.%', '%'],
    ['mass %', '%'],
    ['Percent', '%'],
    ['ppm', 'ppm'],
    ['PPM', 'ppm'],
    ['mg/kg', 'ppm'],
    ['µg/g', 'ppm'],
    ['ug/g', 'ppm'],
    ['ppb', 'ppb'],
    ['µg/kg', 'ppb'],
    ['μg/kg', 'ppb'],
    ['ug/kg', 'ppb'],
    ['fraction', 'fraction'],
    ['mass  fraction', 'fraction'],
    ['kg/kg', 'fraction'],
    [' g/g ', 'fraction'],
  ])('%s → %s', (text, unit) => {
    expect(parseUnit(text)).toBe(unit);
  });

  it('tells the micro sign (U+00B5) and Greek mu (U+03BC) apart but accepts both', () => {
    expect('µ'.codePointAt(0)).toBe(0xb5);
    expect('μ'.codePointAt(0)).toBe(0x3bc);
    expect(parseUnit('\u00b5g/kg')).toBe('ppb');
    expect(parseUnit('\u03bcg/kg')).toBe('ppb');
  });

  it('refuses units that are not mass fractions', () => {
    for (const text of ['mol%', 'at%', 'g', 'mg/l', 'ppt', '']) expect(parseUnit(text)).toBeUndefined();
  });

  it('refuses the names of Object\'s members (a header "Mn constructor" names no unit)', () => {
    for (const text of ['constructor', '__proto__', 'toString', 'valueOf', 'hasOwnProperty', '__defineGetter__'])
      expect(parseUnit(text)).toBeUndefined();
  });
});
