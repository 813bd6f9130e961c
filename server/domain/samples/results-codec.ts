// How a sample's results are stored: one JSON document per sample, with fields at their usual
// value left out (no qualifier, no flags, no SD for one burn, raw mean equal to the mean …).
// A 20,000-burn import stores 6,667 documents of 25 elements; leaving defaults out makes them
// about a third smaller, which is a third less to write. decodeResults restores every field.
import type { StoredResult } from './samples.repository.ts';

type Encoded = Partial<StoredResult> & Pick<StoredResult, 'element' | 'n' | 'decimals'>;

const OMITTED_WHEN_NULL = ['mean', 'sd', 'rsd', 'min', 'max', 'reported', 'qualifier', 'repeatability'] as const;

function encodeOne(result: StoredResult): Encoded {
  const out: Record<string, unknown> = { element: result.element, n: result.n, decimals: result.decimals };
  for (const key of OMITTED_WHEN_NULL) if (result[key] !== null) out[key] = result[key];
  if (result.raw_mean !== result.mean) out.raw_mean = result.raw_mean;
  if (result.flags.length > 0) out.flags = result.flags;
  if (result.n_qualified !== 0) out.n_qualified = result.n_qualified;
  return out as Encoded;
}

function decodeOne(stored: Encoded): StoredResult {
  const mean = stored.mean ?? null;
  return {
    element: stored.element,
    mean,
    sd: stored.sd ?? null,
    rsd: stored.rsd ?? null,
    n: stored.n,
    min: stored.min ?? null,
    max: stored.max ?? null,
    reported: stored.reported ?? null,
    qualifier: stored.qualifier ?? null,
    flags: stored.flags ?? [],
    n_qualified: stored.n_qualified ?? 0,
    repeatability: stored.repeatability ?? null,
    raw_mean: stored.raw_mean === undefined ? mean : stored.raw_mean,
    decimals: stored.decimals,
  };
}

export function encodeResults(results: StoredResult[]): string {
  return JSON.stringify(results.map(encodeOne));
}

export function decodeResults(text: string): StoredResult[] {
  return (JSON.parse(text) as Encoded[]).map(decodeOne);
}
