// Turns a sample's included burns into per-element results, in the method's element order.
// Elements the method does not list are still averaged (nothing measured is dropped) with
// DEFAULT_DECIMALS and the flag `not_in_method`.
import { type BurnCell, computeElementResult, RESULT_FLAG_NAMES, type ResultFlag } from '../chemistry/element-result.ts';
import { exactMean } from '../chemistry/exact-mean.ts';
import type { Method, MethodElement } from '../methods/methods.repository.ts';
import type { StoredCell, StoredResult } from './samples.repository.ts';

/** Reporting decimals for elements the method does not list (flag `not_in_method`). */
export const DEFAULT_DECIMALS = 4;

export interface BurnForResults {
  excluded: boolean;
  /** Canonical values as measured. */
  values: Record<string, StoredCell>;
  /** Values after drift correction; absent (or null) when no correction applies. */
  corrected?: Record<string, StoredCell> | null;
}

function settingsFor(method: Method, element: string): { settings: MethodElement; inMethod: boolean } {
  const found = method.elements.find((e) => e.element === element);
  if (found) return { settings: found, inMethod: true };
  return {
    settings: { element, decimals: DEFAULT_DECIMALS, working_range_low: null, working_range_high: null, detection_limit: null, repeatability_sd: null },
    inMethod: false,
  };
}

function toCell(cell: StoredCell | undefined): BurnCell | undefined {
  return cell && { value: cell.v, qualifier: cell.q };
}

/** The mean of the measured (uncorrected) numeric values — what computeElementResult reports as `mean`. */
function rawMean(burns: BurnForResults[], element: string): string | null {
  const numeric = burns.flatMap((b) => {
    const cell = b.values[element];
    return cell && cell.q === null && cell.v !== null ? [cell.v] : [];
  });
  return numeric.length ? exactMean(numeric) : null;
}

export function elementOrder(method: Method, burns: BurnForResults[]): string[] {
  const measured = new Set(burns.flatMap((b) => Object.keys(b.values)));
  const inMethod = method.elements.map((e) => e.element).filter((el) => measured.has(el));
  const extra = [...measured].filter((el) => !method.elements.some((e) => e.element === el)).sort();
  return [...inMethod, ...extra];
}

export function computeSampleResults(burns: BurnForResults[], method: Method): { results: StoredResult[]; flags: string[] } {
  const included = burns.filter((b) => !b.excluded);
  const results: StoredResult[] = [];
  for (const element of elementOrder(method, burns)) {
    const { settings, inMethod } = settingsFor(method, element);
    const corrected = computeElementResult({ element, cells: included.map((b) => toCell((b.corrected ?? b.values)[element])), settings });
    const raw = included.some((b) => b.corrected) ? rawMean(included, element) : corrected.mean;
    const extra: ResultFlag[] = [];
    if (!inMethod) extra.push('not_in_method');
    // Corrected values are kept below 0 rather than clamped (see RESULT_FLAGS); the flag says so.
    if (included.some((b) => b.corrected?.[element]?.v?.startsWith('-'))) extra.push('negative_after_correction');
    results.push({
      ...corrected,
      raw_mean: raw,
      decimals: settings.decimals,
      flags: extra.length ? RESULT_FLAG_NAMES.filter((f) => corrected.flags.includes(f) || extra.includes(f)) : corrected.flags,
    });
  }
  const flags = [...new Set(results.flatMap((r) => r.flags))].sort();
  return { results, flags };
}
