// Turns a sample's included burns into per-element results, in the method's element order.
// Elements the method does not list are still averaged (nothing measured is dropped) with
// DEFAULT_DECIMALS and the flag `not_in_method`, and reported only when the method says so. The
// matrix element comes last, by difference, when the method reports a balance (sample-totals.ts).
// Written with plain loops: a bulk import runs this for every sample × element (hundreds of
// thousands of times).
import { type BurnCell, computeElementResult, type ElementSettings, type ResultFlag } from '../chemistry/element-result.ts';
import { exactMean } from '../chemistry/exact-mean.ts';
import type { Method, MethodElement } from '../methods/methods.repository.ts';
import { balanceResult, sumAboveHundred } from './sample-totals.ts';
import type { StoredCell, StoredResult } from './samples.repository.ts';

/** Reporting decimals for elements the method does not list (flag `not_in_method`). */
const DEFAULT_DECIMALS = 4;

export interface BurnForResults {
  excluded: boolean;
  /** Canonical values as measured. */
  values: Record<string, StoredCell>;
  /** Values after drift correction; absent (or null) when no correction applies. */
  corrected?: Record<string, StoredCell> | null;
}

type Settings = MethodElement & ElementSettings;
const settingsCache = new WeakMap<Method, Map<string, Settings>>();

/** Each listed element's settings with the method's rule for mixed burns, built once per method. */
function settingsOf(method: Method): Map<string, Settings> {
  let settings = settingsCache.get(method);
  if (!settings) {
    const mixed = method.reporting.mixed_qualified_burns;
    settings = new Map(method.elements.map((e) => [e.element, { ...e, mixed_qualified_burns: mixed }]));
    settingsCache.set(method, settings);
  }
  return settings;
}

function defaultSettings(element: string, method: Method): Settings {
  return {
    mixed_qualified_burns: method.reporting.mixed_qualified_burns,
    element,
    decimals: DEFAULT_DECIMALS,
    working_range_low: null,
    working_range_high: null,
    detection_limit: null,
    repeatability_sd: null,
  };
}

/** Method elements first (in the method's order), then any others alphabetically. */
function elementOrder(method: Method, burns: BurnForResults[]): string[] {
  const measured = new Set<string>();
  for (const burn of burns) for (const element in burn.values) measured.add(element);
  const ordered: string[] = [];
  for (const e of method.elements) if (measured.delete(e.element)) ordered.push(e.element);
  return measured.size ? ordered.concat([...measured].sort()) : ordered;
}

function cellsOf(burns: BurnForResults[], element: string): (BurnCell | undefined)[] {
  const cells = new Array<BurnCell | undefined>(burns.length);
  for (let i = 0; i < burns.length; i++) {
    const cell = (burns[i].corrected ?? burns[i].values)[element];
    cells[i] = cell === undefined ? undefined : { value: cell.v, qualifier: cell.q };
  }
  return cells;
}

/** The mean of the measured (uncorrected) numeric values — what computeElementResult reports as `mean`. */
function rawMean(burns: BurnForResults[], element: string): string | null {
  const numeric: string[] = [];
  for (const burn of burns) {
    const cell = burn.values[element];
    if (cell && cell.q === null && cell.v !== null) numeric.push(cell.v);
  }
  return numeric.length ? exactMean(numeric) : null;
}

/** A corrected value (or bound) below 0 — kept, not clamped (see RESULT_FLAGS), and flagged. */
function negativeAfterCorrection(burns: BurnForResults[], element: string): boolean {
  for (const burn of burns) if (burn.corrected?.[element]?.v?.startsWith('-')) return true;
  return false;
}

export function computeSampleResults(burns: BurnForResults[], method: Method): { results: StoredResult[]; flags: ResultFlag[] } {
  const included = burns.filter((b) => !b.excluded);
  const anyCorrected = included.some((b) => b.corrected != null);
  const settingsByElement = settingsOf(method);
  const { reporting } = method;
  const balance = reporting.balance_by_difference ? method.matrix : null;
  const results: StoredResult[] = [];
  const flags = new Set<ResultFlag>();
  for (const element of elementOrder(method, burns)) {
    if (element === balance) continue; // by difference below; its measured burns stay in the burns
    const known = settingsByElement.get(element);
    const settings = known ?? defaultSettings(element, method);
    const result = computeElementResult({ element, cells: cellsOf(included, element), settings }) as StoredResult;
    result.raw_mean = anyCorrected ? rawMean(included, element) : result.mean;
    result.decimals = settings.decimals;
    // In RESULT_FLAGS order: negative_after_correction comes just before not_in_method, the last.
    if (anyCorrected && negativeAfterCorrection(included, element)) result.flags.push('negative_after_correction' satisfies ResultFlag);
    if (!known) {
      result.flags.push('not_in_method' satisfies ResultFlag);
      if (reporting.unlisted_elements !== 'report') Object.assign(result, { reported: null, qualifier: null });
    }
    for (const flag of result.flags) flags.add(flag);
    results.push(result);
  }
  if (balance) {
    const decimals = settingsByElement.get(balance)?.decimals;
    results.push(balanceResult(balance, results, decimals));
    flags.add('balance_by_difference');
  }
  if (sumAboveHundred(results, reporting.sum_tolerance)) flags.add('sum_above_100');
  return { results, flags: [...flags].sort() };
}
