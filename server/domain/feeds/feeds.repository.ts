// The only code that touches the instrument_feeds table.
import type { Queryable } from '../../db/transaction.ts';

export interface InstrumentFeedRow {
  instrument_id: string;
  agent_version: string;
  agent_host: string | null;
  queue_length: number;
  last_success_at: string | null;
  last_file_name: string | null;
  last_file_at: string | null;
  last_error: string | null;
  last_error_at: string | null;
  reported_at: string;
  reported_by_label: string;
  /** The stale alert for the current silence went out then; a heartbeat clears it. */
  stale_alerted_at: string | null;
}

export function findFeedRows(db: Queryable, instrumentIds: string[]): Promise<InstrumentFeedRow[]> {
  return db<InstrumentFeedRow>('instrument_feeds').whereIn('instrument_id', instrumentIds);
}

/** One row per instrument: a heartbeat replaces what the previous one said. */
export async function saveFeedRow(db: Queryable, row: InstrumentFeedRow): Promise<void> {
  await db<InstrumentFeedRow>('instrument_feeds').insert(row).onConflict('instrument_id').merge();
}

/** Feeds silent since before `before` whose silence has not been alerted yet, with the instrument's code. */
export function silentFeedRows(db: Queryable, before: string): Promise<(InstrumentFeedRow & { instrument_code: string })[]> {
  return db('instrument_feeds')
    .join('instruments', 'instruments.id', 'instrument_feeds.instrument_id')
    .where('instrument_feeds.reported_at', '<', before)
    .whereNull('instrument_feeds.stale_alerted_at')
    .select('instrument_feeds.*', 'instruments.code as instrument_code')
    .orderBy('instruments.code');
}

export async function markStaleAlerted(db: Queryable, instrumentId: string, at: string): Promise<void> {
  await db('instrument_feeds').where({ instrument_id: instrumentId }).update({ stale_alerted_at: at });
}
