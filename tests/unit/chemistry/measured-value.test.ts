import { describe, expect, it } from 'vitest';
import { MeasuredValueError, parseMeasuredValue } from '../../../server/domain/chemistry/measured-value.ts';

describe('parseMeasuredValue', () => {
  it('reads plain numbers as exact decimal strings', () => {
    expect(parseMeasuredValue('0.75')).toEqual({ kind: 'value', value: '0.75', qualifier: null });
    expect(parseMeasuredValue(' 0.750 ')).toEqual({ kind: 'value', value: '0.75', qualifier: null });
    expect(parseMeasuredValue('.5')).toEqual({ kind: 'value', value: '0.5', qualifier: null });
    expect(parseMeasuredValue('18')).toEqual({ kind: 'value', value: '18', qualifier: null });
    expect(parseMeasuredValue('0')).toEqual({ kind: 'value', value: '0', qualifier: null });
  });

  it('writes exponent input in plain notation', () => {
    expect(parseMeasuredValue('5e-8')).toEqual({ kind: 'value', value: '0.00000005', qualifier: null });
    expect(parseMeasuredValue('1.5E3')).toEqual({ kind: 'value', value: '1500', qualifier: null });
  });

  it('reads JSON numbers through their shortest decimal form (0.1 stays 0.1)', () => {
    expect(parseMeasuredValue(0.1)).toEqual({ kind: 'value', value: '0.1', qualifier: null });
    expect(parseMeasuredValue(1e-7)).toEqual({ kind: 'value', value: '0.0000001', qualifier: null });
    expect(() => parseMeasuredValue(Number.NaN)).toThrow(MeasuredValueError);
    expect(() => parseMeasuredValue(Number.POSITIVE_INFINITY)).toThrow(MeasuredValueError);
  });

  it('reads "<" and ">" as qualified values, with or without a space', () => {
    expect(parseMeasuredValue('<0.0005')).toEqual({ kind: 'qualified', value: '0.0005', qualifier: '<' });
    expect(parseMeasuredValue('< 0.0005')).toEqual({ kind: 'qualified', value: '0.0005', qualifier: '<' });
    expect(parseMeasuredValue('>1.5')).toEqual({ kind: 'qualified', value: '1.5', qualifier: '>' });
  });

  it('reads not-detected markers in any casing', () => {
    for (const text of ['n.d.', 'N.D.', 'nd', 'ND', 'n.d', 'not detected', 'BDL']) {
      expect(parseMeasuredValue(text)).toEqual({ kind: 'not_detected', value: null, qualifier: 'nd' });
    }
  });

  it('reads blank cells as not measured', () => {
    for (const raw of ['', '   ', null, undefined]) expect(parseMeasuredValue(raw)).toEqual({ kind: 'blank' });
  });

  it('honours a comma decimal separator and refuses the point then', () => {
    expect(parseMeasuredValue('0,75', ',')).toEqual({ kind: 'value', value: '0.75', qualifier: null });
    expect(parseMeasuredValue('<0,001', ',')).toEqual({ kind: 'qualified', value: '0.001', qualifier: '<' });
    expect(() => parseMeasuredValue('1.234', ',')).toThrow(MeasuredValueError);
    expect(() => parseMeasuredValue('0,75')).toThrow(MeasuredValueError); // "," with the "." layout
  });

  it('refuses text, negative mass fractions and doubled qualifiers', () => {
    for (const text of ['abc', '0.75%', '1.2.3', '--1', '<<1', '<', '0x10', 'Infinity', 'NaN']) {
      expect(() => parseMeasuredValue(text), text).toThrow(MeasuredValueError);
    }
    expect(() => parseMeasuredValue('-0.1')).toThrow(/negative/);
    expect(() => parseMeasuredValue(-0.1)).toThrow(/negative/);
  });

  it('accepts a negative zero as zero', () => {
    expect(parseMeasuredValue('-0')).toEqual({ kind: 'value', value: '0', qualifier: null });
    expect(parseMeasuredValue('-0.000')).toEqual({ kind: 'value', value: '0', qualifier: null });
  });
});
