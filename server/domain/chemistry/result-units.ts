// A computed result (stored in %) returned in ppm (mg/kg) or ppb (µg/kg) for `?unit=`.
//
// Every factor is a power of ten (1 % = 10^4 ppm = 10^7 ppb; SI brochure, NIST SP 811 §7.10), so
// converting moves the decimal point and is exact for the decimal strings (mean, min, max,
// reported bound, range). The SD, a double, is scaled through its shortest decimal form, so
// 0.0001 % becomes exactly 1 ppm and not 1.0000000000000002.
//
// Reporting precision follows the method's decimals in %: the same place, expressed in the other
// unit, i.e. decimals − 4 in ppm and decimals − 7 in ppb. 4 decimals in % (0.0001 % = 1 ppm) →
// 0 decimals in ppm; 5 → 1; 2 decimals in % (0.01 % = 100 ppm) → −2, i.e. ppm rounded to the
// hundred and written without decimals (0.07 % → "700"). The numeric `reported` is rounded again
// from the full-precision mean in the new unit — never from the already rounded % string. Because
// the scale is a power of ten, half-even rounding lands on the same value either way; the
// conversion test checks that. A "<"/">" bound is a limit, not a rounded mean: it is scaled exactly.
import { Decimal } from 'decimal.js';
import type { ElementResult } from './element-result.ts';
import { roundHalfEven } from './rounding.ts';
import { fromPercent, PERCENT_SHIFT, type OutputUnit } from './units.ts';

export interface UnitElementResult extends ElementResult {
  unit: OutputUnit;
}

/** The reporting decimals in `unit` that correspond to `decimalsInPercent` (may be negative). */
export function reportingDecimals(decimalsInPercent: number, unit: OutputUnit): number {
  return decimalsInPercent - PERCENT_SHIFT[unit];
}

/** Converts a result computed in % to `unit`; `decimalsInPercent` are the method's decimals. */
export function convertResult(result: ElementResult, unit: OutputUnit, decimalsInPercent: number): UnitElementResult {
  if (unit === '%') return { ...result, unit };
  const decimals = reportingDecimals(decimalsInPercent, unit);
  const scale = (value: string | null) => (value === null ? null : fromPercent(value, unit));
  let reported: string | null = null;
  if (result.reported !== null) {
    reported =
      result.qualifier === null && result.mean !== null
        ? roundHalfEven(fromPercent(result.mean, unit), decimals)
        : new Decimal(fromPercent(result.reported, unit)).toFixed(Math.max(0, decimals));
  }
  const repeatability = result.repeatability && {
    ...result.repeatability,
    range: fromPercent(result.repeatability.range, unit),
    critical_range: fromPercent(result.repeatability.critical_range, unit),
  };
  return {
    ...result,
    unit,
    mean: scale(result.mean),
    min: scale(result.min),
    max: scale(result.max),
    sd: result.sd === null ? null : Number(fromPercent(new Decimal(result.sd).toString(), unit)),
    reported,
    repeatability,
  };
}
