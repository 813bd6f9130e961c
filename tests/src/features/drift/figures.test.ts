import { describe, expect, it } from 'vitest';
import { changeFigure, levelFigure, offsetFigure, offsetUnit, slopeFigure } from '../../../../src/features/drift/figures.ts';

// Expected values by hand (half-even rounding, ASTM E29 style).
describe('standardization figures', () => {
  it('writes offsets of trace elements in ppm, the others in % with one guard digit', () => {
    expect(offsetUnit(4)).toBe('ppm');
    expect(offsetUnit(3)).toBe('%');
    // B reported to 4 decimals: -0.0000068265 % = -0.068265 ppm → "-0.1" ppm.
    expect(offsetFigure('-0.0000068265', 4)).toBe('-0.1');
    // Mn reported to 2 decimals: -0.0000050457 % → 3 decimals → "0.000" (no "-0.000").
    expect(offsetFigure('-0.0000050457', 2)).toBe('0.000');
    expect(offsetFigure('0.00585', 2)).toBe('0.006');
    // Half-even: 0.0125 → 0.012 at 3 places.
    expect(offsetFigure('0.0125', 2)).toBe('0.012');
    expect(offsetFigure(null, 2)).toBe('—');
  });

  it('writes levels, slopes and changes', () => {
    expect(levelFigure('0.82012', 3)).toBe('0.8201');
    expect(levelFigure('0.1065', 2)).toBe('0.106');
    expect(slopeFigure('1.0239520958083832335')).toBe('1.024');
    expect(slopeFigure('0.45454545')).toBe('0.45455');
    expect(changeFigure('0.0752688')).toBe('+7.5 %');
    expect(changeFigure('-0.16666')).toBe('−16.7 %');
    expect(changeFigure('-0.0001')).toBe('0.0 %');
    expect(changeFigure(null)).toBe('—');
  });
});
