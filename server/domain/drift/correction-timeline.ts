// Which correction set applies to a burn: the set in force for the instrument and method at the
// burn's measurement time (else the sample's creation time) — the activated set with the latest
// effective_from at or before that time; among equal effective_from, the later activation.
import type { Queryable } from '../../db/transaction.ts';
import type { StoredCell } from '../samples/samples.repository.ts';
import { type Correction, correctCells } from './correction-math.ts';
import { type ElementCorrection, listActivatedRows, type StandardizationRow } from './standardizations.repository.ts';

export interface CorrectionSet {
  id: string;
  /** Corrected elements only (slope and offset set). */
  corrections: ReadonlyMap<string, Correction>;
}

export function correctionSetOf(row: Pick<StandardizationRow, 'id' | 'corrections_json'>): CorrectionSet {
  const elements = JSON.parse(row.corrections_json) as ElementCorrection[];
  const corrections = new Map<string, Correction>();
  for (const e of elements) if (e.slope !== null && e.offset !== null) corrections.set(e.element, { slope: e.slope, offset: e.offset });
  return { id: row.id, corrections };
}

/** What a timeline is made of: the activated sets ordered by effective_from, then activated_at. */
export type TimelineRow = Pick<StandardizationRow, 'id' | 'corrections_json' | 'effective_from'>;

export class CorrectionTimeline {
  private readonly entries: { from: number; set: CorrectionSet }[];

  /** `rows`: as timelineRows() returns them. */
  constructor(rows: readonly TimelineRow[]) {
    this.entries = rows.map((row) => ({ from: Date.parse(row.effective_from as string), set: correctionSetOf(row) }));
  }

  /** The set in force at `time` (ISO 8601), or null before the first activation. */
  at(time: string): CorrectionSet | null {
    const t = Date.parse(time);
    let found: CorrectionSet | null = null;
    for (const entry of this.entries) {
      if (entry.from > t) break;
      found = entry.set;
    }
    return found;
  }

  get isEmpty(): boolean {
    return this.entries.length === 0;
  }
}

/** The rows of the instrument's and method's timeline, as plain data (e.g. for a worker thread). */
export async function timelineRows(db: Queryable, instrumentId: string, methodId: string): Promise<TimelineRow[]> {
  const rows = await listActivatedRows(db, instrumentId, methodId);
  return rows.map(({ id, corrections_json, effective_from }) => ({ id, corrections_json, effective_from }));
}

/** Loads the timelines of the (instrument, method) pairs asked for, each once. Call it inside the
 * transaction that stores the samples, so that an activation cannot slip in between. */
export function timelineLoader(db: Queryable): (instrumentId: string, methodId: string) => Promise<CorrectionTimeline> {
  const loaded = new Map<string, CorrectionTimeline>();
  return async (instrumentId, methodId) => {
    const key = `${instrumentId}|${methodId}`;
    let timeline = loaded.get(key);
    if (!timeline) {
      timeline = new CorrectionTimeline(await listActivatedRows(db, instrumentId, methodId));
      loaded.set(key, timeline);
    }
    return timeline;
  };
}

export interface CorrectedBurn {
  correction_set_id: string | null;
  /** Every value of the burn after correction (uncorrected elements copied); null when no set applies. */
  corrected: Record<string, StoredCell> | null;
}

export function correctBurn(values: Record<string, StoredCell>, set: CorrectionSet | null): CorrectedBurn {
  return set
    ? { correction_set_id: set.id, corrected: correctCells(values, set.corrections) }
    : { correction_set_id: null, corrected: null };
}

/** How a sample's correction was chosen, stored with the sample (samples.correction_json). */
export interface SampleCorrection {
  applied_to: 'concentration';
  /** Distinct sets applied to its burns, in burn order. */
  set_ids: string[];
  selection: 'measurement_time' | 'requested';
  reason: string | null;
  recomputed_by: string | null;
  recomputed_at: string | null;
}

/** The record for burns corrected at ingest; null when no burn was corrected. */
export function ingestCorrection(burns: readonly CorrectedBurn[]): SampleCorrection | null {
  const ids = distinctSetIds(burns);
  if (ids.length === 0) return null;
  return {
    applied_to: 'concentration',
    set_ids: ids,
    selection: 'measurement_time',
    reason: null,
    recomputed_by: null,
    recomputed_at: null,
  };
}

export function distinctSetIds(burns: readonly CorrectedBurn[]): string[] {
  return [...new Set(burns.map((b) => b.correction_set_id).filter((id): id is string => id !== null))];
}
