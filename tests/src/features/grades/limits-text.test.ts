// Limits typed as text keep their written decimals: "0.40" is not "0.4" (docs/references.md#rounding).
import { describe, expect, it } from 'vitest';
import { limitsText, parseLimits } from '../../../../src/features/grades/limits-text.ts';

describe('limits typed as text', () => {
  it('reads ranges, maxima and minima, keeping trailing zeros', () => {
    expect(parseLimits('C 0.43–0.50\nP 0.040\n\nSi >=0.40\nCr 18.0-20.0')).toEqual({
      limits: [
        { element: 'C', min: '0.43', max: '0.50' },
        { element: 'P', max: '0.040' },
        { element: 'Si', min: '0.40' },
        { element: 'Cr', min: '18.0', max: '20.0' },
      ],
    });
  });

  it('names the first line it cannot read', () => {
    expect(parseLimits('C 0.43–0.50\nMn lots')).toEqual({ error: 'Line 2 ("Mn lots") is not "El min–max", "El max" or "El >=min".' });
    expect(parseLimits('  ')).toEqual({ error: 'Give at least one limit.' });
  });

  it('writes back what it read', () => {
    const text = 'C 0.43–0.50\nP 0.040\nSi >=0.40';
    const parsed = parseLimits(text);
    expect('limits' in parsed && limitsText(parsed.limits)).toBe(text);
  });
});
