// toPercent / fromPercent return plain decimal strings, never exponent notation.
// Relations from NIST SP 811 §7.10 and the SI brochure: 1 µg/kg = 0.0000001 %, 1 mg/kg = 0.0001 %.
import { describe, expect, it } from 'vitest';
import { fromPercent, toPercent } from '../../../server/domain/chemistry/units.ts';

describe('unit conversion output', () => {
  it('writes small and large results in plain notation', () => {
    expect(toPercent('5', 'ppb')).toBe('0.0000005');
    expect(toPercent('0.3', 'ppb')).toBe('0.00000003');
    expect(toPercent('1', 'ppm')).toBe('0.0001');
    expect(fromPercent('0.0000001', '%')).toBe('0.0000001');
    expect(fromPercent('100', 'ppb')).toBe('1000000000');
    expect(fromPercent('12345678901234567890', 'ppb')).toBe('123456789012345678900000000');
  });
});
