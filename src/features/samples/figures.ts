// How chemistry figures are written in the console. `reported` comes rounded from the server
// (ASTM E29, method decimals); other statistics are shown with two guard digits beyond the
// reporting decimals (a display choice: common practice, no source) and their full value on
// hover. Rounding uses decimal.js half-even, never Number.toFixed (binary floats round 0.125 and
// 0.135 differently).
import { Decimal } from 'decimal.js';

const NO_VALUE = '—';
const GUARD_DIGITS = 2;

type Qualifier = '<' | '>' | 'nd' | null;

/** Plain decimal notation of a number, without exponent ("0.0000001", never "1e-7"). */
export function plain(value: number): string {
  const d = new Decimal(value);
  return d.isZero() ? '0' : d.toFixed();
}

/** `value` rounded half to even to `places` decimals (0 when negative), written with trailing zeros. */
export function roundedFigure(value: number | null, places: number): string {
  if (value === null) return NO_VALUE;
  const fixed = new Decimal(value).toDecimalPlaces(Math.max(0, places), Decimal.ROUND_HALF_EVEN).toFixed(Math.max(0, places));
  return /^-0(\.0*)?$/.test(fixed) ? fixed.slice(1) : fixed;
}

/** A statistic (mean, SD, min, max) next to a result reported with `decimals`. */
export function statistic(value: number | null, decimals: number): string {
  return roundedFigure(value, decimals + GUARD_DIGITS);
}

/** The reporting step for `decimals` places: "0.01" for 2, "1" for 0 (the API never gives fewer than 0 decimals). */
export function reportingStep(decimals: number): string {
  return new Decimal(10).pow(-decimals).toFixed();
}

/** RSD in % with two decimals. */
export function rsdFigure(rsd: number | null): string {
  return roundedFigure(rsd, 2);
}

/** The reported value with its qualifier ("<0.002"), or a dash when nothing is reported. */
export function reportedFigure(result: { reported: string | null; qualifier: '<' | '>' | null }): string {
  return result.reported === null ? NO_VALUE : `${result.qualifier ?? ''}${result.reported}`;
}

/**
 * One burn value in the requested unit: numeric values at the precision of the element's mean
 * (`decimals` + guard digits, the same as the mean beside them) so a column's decimals align;
 * "<"/">" limits as stated; n.d. for not detected. Without `decimals`, the value in full.
 */
export function burnFigure(cell: { value: number | null; qualifier: Qualifier }, decimals: number | null = null): string {
  if (cell.qualifier === 'nd') return 'n.d.';
  if (cell.value === null) return cell.qualifier ?? NO_VALUE;
  if (cell.qualifier) return `${cell.qualifier}${plain(cell.value)}`;
  return decimals === null ? plain(cell.value) : statistic(cell.value, decimals);
}

/** "2–4, 7" from [2, 3, 4, 7]: file lines, compactly. */
export function lineRanges(lines: number[]): string {
  const sorted = [...new Set(lines)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length; i += 1) {
    const start = sorted[i];
    while (i + 1 < sorted.length && sorted[i + 1] === sorted[i] + 1) i += 1;
    parts.push(start === sorted[i] ? String(start) : `${start}–${sorted[i]}`);
  }
  return parts.join(', ');
}
