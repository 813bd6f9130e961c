// Element cells → exact % strings. The string fast path is checked against decimal.js on random
// decimals, and unit conversion against the SI relations (NIST SP 811 §7.10: 1 % = 10 000 mg/kg
// = 10 000 000 µg/kg; mass fraction 1 = 100 %) computed independently with decimal.js.
import { Decimal } from 'decimal.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CellError, normalisePlainDecimal, readCell } from '../../../server/domain/imports/parse/cell-value.ts';

const plainDecimal = fc
  .tuple(fc.stringMatching(/^\d{1,6}$/), fc.option(fc.stringMatching(/^\d{1,9}$/), { nil: undefined }))
  .map(([int, fraction]) => (fraction === undefined ? int : `${int}.${fraction}`));

describe('normalisePlainDecimal', () => {
  it('gives the same string as decimal.js toFixed() for any plain decimal', () => {
    fc.assert(
      fc.property(plainDecimal, (text) => {
        expect(normalisePlainDecimal(text, text.indexOf('.'))).toBe(new Decimal(text).toFixed());
      }),
      { numRuns: 2000 },
    );
  });
});

describe('readCell', () => {
  const PER_PERCENT = { '%': '1', ppm: '10000', ppb: '10000000', fraction: '0.01' } as const;

  it('converts every unit exactly (decimal.js, SI relations)', () => {
    fc.assert(
      fc.property(plainDecimal, fc.constantFrom('%', 'ppm', 'ppb', 'fraction' as const), (text, unit) => {
        const expected = new Decimal(text).div(PER_PERCENT[unit]);
        if (expected.gt(100)) {
          expect(() => readCell(text, '.', unit)).toThrow(CellError);
          return;
        }
        expect(readCell(text, '.', unit)).toEqual({ value: expected.toFixed(), qualifier: null, raw: text, unit });
        expect(readCell(text.replace('.', ','), ',', unit)?.value).toBe(expected.toFixed());
      }),
      { numRuns: 2000 },
    );
  });

  it.each([
    ['<0.0005', '%', { value: '0.0005', qualifier: '<' }],
    ['> 1.5', '%', { value: '1.5', qualifier: '>' }],
    ['<5', 'ppb', { value: '0.0000005', qualifier: '<' }],
    ['n.d.', 'ppm', { value: null, qualifier: 'nd' }],
    ['ND', '%', { value: null, qualifier: 'nd' }],
    ['1.5E-3', '%', { value: '0.0015', qualifier: null }],
    ['+0.20', '%', { value: '0.2', qualifier: null }],
    ['100', '%', { value: '100', qualifier: null }],
    ['1', 'fraction', { value: '100', qualifier: null }],
    ['1000000', 'ppm', { value: '100', qualifier: null }],
  ])('%s in %s', (raw, unit, expected) => {
    expect(readCell(raw, '.', unit as never)).toEqual({ ...expected, raw, unit });
  });

  it('a blank cell is not measured', () => {
    expect(readCell('  ', '.', '%')).toBeNull();
  });

  it.each(['0.7.5', 'abc', '-0.01', '100.0001', '1000001', '1000000.1', '1.01e2', '1e-40', '1,5', '0x10', 'Infinity', 'NaN'])(
    'refuses %s',
    (raw) => {
      const unit = raw.startsWith('1000000') ? 'ppm' : '%';
      expect(() => readCell(raw, '.', unit)).toThrow(CellError);
    },
  );
});
