import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { roundHalfEven } from '../../../../server/domain/chemistry/rounding.ts';
import {
  burnFigure,
  reportingStep,
  lineRanges,
  plain,
  reportedFigure,
  roundedFigure,
  rsdFigure,
  statistic,
} from '../../../../src/features/samples/figures.ts';
import { decimalString } from '../../../helpers/decimal-arbitrary.ts';

describe('roundedFigure', () => {
  // ASTM E29 / ISO 80000-1 Annex B rule A pairs, as listed in docs/references.md#rounding.
  // Given as numbers, as the API's statistics are: 12.35 and 42.85
  // are not exact binary floats, and (12.35).toFixed(1) would give "12.3".
  it.each([
    [56.748, 1, '56.7'],
    [2.146, 2, '2.15'],
    [21.4501, 1, '21.5'],
    [21.35, 1, '21.4'],
    [21.45, 1, '21.4'],
    [42.85, 1, '42.8'],
    [42.35, 1, '42.4'],
    [12.25, 1, '12.2'],
    [12.35, 1, '12.4'],
    [12.45, 1, '12.4'],
  ])('ASTM E29: %s at %i decimals → %s', (value, places, expected) => {
    expect(roundedFigure(value, places)).toBe(expected);
  });

  it("agrees with the server's reporting rounding for every value a float holds exactly enough (property)", () => {
    // Up to 15 significant digits, a decimal survives the trip through a JavaScript number.
    fc.assert(
      fc.property(
        decimalString({ maxDigits: 999_999_999_999_999n, maxScale: 12, signs: ['', '', '-'] }),
        fc.integer({ min: 0, max: 8 }),
        (text, places) => {
          expect(roundedFigure(Number(text), places)).toBe(roundHalfEven(text, places));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('writes trailing zeros, no negative zero, and a dash for no value', () => {
    expect(roundedFigure(0.7, 3)).toBe('0.700');
    expect(roundedFigure(-0.0001, 2)).toBe('0.00');
    expect(roundedFigure(null, 2)).toBe('—');
    expect(roundedFigure(7533.3333, -2)).toBe('7533'); // ppm: reporting decimals below zero show whole units
  });
});

describe('chemistry figures', () => {
  it('shows statistics with two guard digits beyond the reporting decimals, RSD with two', () => {
    expect(statistic(0.75333333, 2)).toBe('0.7533');
    expect(statistic(0.0057735, 2)).toBe('0.0058');
    expect(rsdFigure(0.766391)).toBe('0.77');
    expect(rsdFigure(null)).toBe('—');
  });

  it('writes values in plain notation, never with an exponent', () => {
    expect(plain(1e-7)).toBe('0.0000001');
    expect(plain(12500000)).toBe('12500000');
    expect(plain(0)).toBe('0');
  });

  it('puts the qualifier before a reported bound and writes n.d. for not detected', () => {
    expect(reportedFigure({ reported: '0.002', qualifier: '<' })).toBe('<0.002');
    expect(reportedFigure({ reported: '0.71', qualifier: null })).toBe('0.71');
    expect(reportedFigure({ reported: null, qualifier: null })).toBe('—');
    expect(burnFigure({ value: 0.0005, qualifier: '<' })).toBe('<0.0005');
    expect(burnFigure({ value: null, qualifier: 'nd' })).toBe('n.d.');
    expect(burnFigure({ value: 0.452, qualifier: null })).toBe('0.452');
  });

  it('writes burns at the precision of their mean, so a column of burns aligns (decimal.js half-even)', () => {
    expect(burnFigure({ value: 0.75, qualifier: null }, 2)).toBe('0.7500');
    expect(burnFigure({ value: 0.751249, qualifier: null }, 2)).toBe('0.7512');
    expect(burnFigure({ value: 0.00125, qualifier: null }, 2)).toBe('0.0012'); // tie to even (ASTM E29)
    expect(burnFigure({ value: 5943.2, qualifier: null }, 0)).toBe('5943.20'); // ppm
    expect(burnFigure({ value: 0.002, qualifier: '<' }, 4)).toBe('<0.002'); // a limit as stated
  });

  it('states the reporting step of a number of decimals', () => {
    expect(reportingStep(2)).toBe('0.01');
    expect(reportingStep(4)).toBe('0.0001');
    expect(reportingStep(0)).toBe('1');
  });

  it('writes file lines as ranges', () => {
    expect(lineRanges([4, 2, 3, 7, 9, 10])).toBe('2–4, 7, 9–10');
    expect(lineRanges([5])).toBe('5');
    expect(lineRanges([])).toBe('');
  });
});
