// What a sample's results say together: the matrix element by difference (when the method
// reports a balance) and whether the reported elements add up to more than 100 %. Both use the
// reported results only (RESULT_RULE_LIST in result-rules.ts states the rules for the API):
//   numeric results at their full-precision mean, "<" results as 0, ">" results at their bound.
import { Decimal } from 'decimal.js';
import { roundHalfEven } from '../chemistry/rounding.ts';
import type { ResultFlag } from '../chemistry/result-rules.ts';
import type { StoredResult } from './samples.repository.ts';

/** Sums of a few dozen decimal strings of at most 34 significant digits: exact at this precision. */
const Exact = Decimal.clone({ precision: 100 });
const HUNDRED = new Exact(100);

/** Reporting decimals of a balance the method does not list. */
const BALANCE_DECIMALS = 2;

/** What one result adds to the sum; null when it reports nothing (the sum is then unknown). */
function contribution(result: StoredResult, value: 'mean' | 'raw_mean'): Decimal | null {
  if (result.reported === null) return null;
  if (result.qualifier === '<') return new Exact(0);
  if (result.qualifier === '>') return new Exact(result.reported);
  const mean = result[value];
  return mean === null ? null : new Exact(mean);
}

/** Σ of the reported results, or null when one that was measured reports nothing. */
function reportedSum(results: readonly StoredResult[], value: 'mean' | 'raw_mean'): Decimal | null {
  let sum = new Exact(0);
  for (const result of results) {
    // Not measured, or measured outside the method and not reported: not part of the sample's report.
    if (result.reported === null && (result.flags.includes('not_measured') || result.flags.includes('not_in_method'))) continue;
    const part = contribution(result, value);
    if (part === null) return null;
    sum = sum.plus(part);
  }
  return sum;
}

/** The reported elements add up to more than 100 % + tolerance (the ones that report nothing left out). */
export function sumAboveHundred(results: readonly StoredResult[], tolerance: string): boolean {
  let sum = new Exact(0);
  for (const result of results) sum = sum.plus(contribution(result, 'mean') ?? 0);
  return sum.gt(HUNDRED.plus(tolerance));
}

const plain = (value: Decimal) => (value.isZero() ? '0' : value.toFixed());

/** The matrix element as 100 % minus the others; reported null when that cannot be known. */
export function balanceResult(element: string, others: readonly StoredResult[], decimals = BALANCE_DECIMALS): StoredResult {
  const sum = reportedSum(others, 'mean');
  const rawSum = reportedSum(others, 'raw_mean');
  const balance = sum && HUNDRED.minus(sum);
  const known = balance !== null && !balance.isNegative();
  const mean = known ? plain(balance) : null;
  return {
    element,
    mean,
    raw_mean: known && rawSum ? plain(HUNDRED.minus(rawSum)) : null,
    sd: null,
    rsd: null,
    n: 0,
    min: null,
    max: null,
    reported: mean === null ? null : roundHalfEven(mean, decimals),
    qualifier: null,
    flags: ['balance_by_difference' satisfies ResultFlag],
    n_qualified: 0,
    repeatability: null,
    decimals,
  };
}
