// Exact order of two decimal strings without decimal.js in the common case. Result statistics
// compare every mean (up to 34 digits) with its limits, so this sits on the ingest hot path.
// Rounding to the nearest double is monotonic (a ≤ b ⇒ double(a) ≤ double(b)), so two DIFFERENT
// doubles already order the decimals they came from; only equal doubles — values within about
// 1e-16 relative of each other, or the same value written differently — need decimal.js.
import { Decimal } from 'decimal.js';

/**
 * −1, 0 or 1 as a is less than, equal to or greater than b. Throws on a non-number. Callers that
 * compare one value many times may pass its double (x = Number(a), y = Number(b)) to save parsing.
 */
function compareDecimals(a: string, b: string, x = Number(a), y = Number(b)): -1 | 0 | 1 {
  if (x < y) return -1;
  if (x > y) return 1;
  return new Decimal(a).cmp(b) as -1 | 0 | 1; // also throws for text that is not a number
}

export function isBelow(a: string, b: string, x = Number(a), y = Number(b)): boolean {
  return compareDecimals(a, b, x, y) < 0;
}

export function isAbove(a: string, b: string, x = Number(a), y = Number(b)): boolean {
  return compareDecimals(a, b, x, y) > 0;
}
