// How the figures of a standardization are written in the console (display only: the API keeps
// every digit, shown on hover). Offsets are written in the element's natural unit: ppm for an
// element the method reports to 0.0001 % or finer (trace levels), else %; nominal-level figures
// get one guard digit beyond the method's reporting decimals (a display choice: common practice,
// no source). Rounding is decimal.js half-even on the decimal strings, never Number.toFixed.
import { Decimal } from 'decimal.js';

const NO_VALUE = '—';
/** An element reported to this many decimals in % or more is a trace element: offsets in ppm. */
const PPM_FROM_DECIMALS = 4;
const GUARD_DIGITS = 1;

export type OffsetUnit = '%' | 'ppm';

function rounded(value: Decimal, places: number): string {
  const fixed = value.toDecimalPlaces(Math.max(0, places), Decimal.ROUND_HALF_EVEN).toFixed(Math.max(0, places));
  return /^-0(\.0*)?$/.test(fixed) ? fixed.slice(1) : fixed;
}

export function offsetUnit(decimals: number): OffsetUnit {
  return decimals >= PPM_FROM_DECIMALS ? 'ppm' : '%';
}

/** An offset (β, %) in the element's natural unit with one guard digit: "-0.0042" %, "1.3" ppm. */
export function offsetFigure(offset: string | null, decimals: number): string {
  if (offset === null) return NO_VALUE;
  return offsetUnit(decimals) === 'ppm'
    ? rounded(new Decimal(offset).times(10_000), decimals + GUARD_DIGITS - PPM_FROM_DECIMALS)
    : rounded(new Decimal(offset), decimals + GUARD_DIGITS);
}

/** An offset as a number in its natural unit, for charting. */
export function offsetInUnit(offset: string, unit: OffsetUnit): number {
  return (unit === 'ppm' ? new Decimal(offset).times(10_000) : new Decimal(offset)).toNumber();
}

/** A mass fraction (%) near the reporting level: the method's decimals plus one guard digit. */
export function levelFigure(value: string | null, decimals: number): string {
  return value === null ? NO_VALUE : rounded(new Decimal(value), decimals + GUARD_DIGITS);
}

/** A slope with 5 significant digits: "1.0240", "0.45455". */
export function slopeFigure(slope: string | null): string {
  return slope === null ? NO_VALUE : new Decimal(slope).toSignificantDigits(5, Decimal.ROUND_HALF_EVEN).toFixed();
}

/** A relative change as signed percent with one decimal: "+7.5 %", "−16.7 %", "0.0 %". */
export function changeFigure(change: string | null): string {
  if (change === null) return NO_VALUE;
  const percent = new Decimal(change).times(100);
  const text = rounded(percent.abs(), 1);
  if (text === '0.0') return '0.0 %';
  return `${percent.isNegative() ? '−' : '+'}${text} %`;
}
