// A computed result (stored in %) returned in ppm (mg/kg) or ppb (µg/kg) for `?unit=`.
//
// Every factor is a power of ten (1 % = 10^4 ppm = 10^7 ppb; SI brochure, NIST SP 811 §7.10), so
// converting moves the decimal point and is exact for the decimal strings (mean, min, max,
// reported bound, range). The SD, a double, is scaled through its shortest decimal form, so
// 0.0001 % becomes exactly 1 ppm and not 1.0000000000000002.
//
// Reporting step in ppm and ppb: the reported value is rounded half to even (ASTM E29) from the
// full-precision mean in THAT unit, to whole ppm (ppb) — or finer when the method's step in % is
// finer (5 decimals in % = 0.1 ppm → 1 decimal in ppm). It is never the % rounding scaled: a Si
// mean of 0.5943 % reported at 2 decimals is "0.59" in %, but "5943" in ppm, not "5900" beside a
// mean of 5943. So every element of a sample is written with the same, stated step in ppm and
// ppb: decimals = max(0, decimals in % − 4) for ppm, max(0, decimals in % − 7) for ppb. The
// numeric precision a reader can rely on is still the method's (its repeatability), which the
// API documentation says beside the step. A "<"/">" bound is a limit, not a rounded mean: it is
// scaled exactly (a power-of-ten shift always fits the step).
import { Decimal } from 'decimal.js';
import type { ElementResult } from './element-result.ts';
import { roundHalfEven } from './rounding.ts';
import { fromPercent, PERCENT_SHIFT, type OutputUnit } from './units.ts';

export interface UnitElementResult extends ElementResult {
  unit: OutputUnit;
}

/** The reporting decimals in `unit` for a method reporting `decimalsInPercent` in %: the same place, but at least whole ppm/ppb. */
export function reportingDecimals(decimalsInPercent: number, unit: OutputUnit): number {
  if (unit === '%') return decimalsInPercent;
  return Math.max(0, decimalsInPercent - PERCENT_SHIFT[unit]);
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
        : new Decimal(fromPercent(result.reported, unit)).toFixed(decimals);
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
