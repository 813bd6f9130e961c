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
}

export function findFeedRows(db: Queryable, instrumentIds: string[]): Promise<InstrumentFeedRow[]> {
  return db<InstrumentFeedRow>('instrument_feeds').whereIn('instrument_id', instrumentIds);
}

/** One row per instrument: a heartbeat replaces what the previous one said. */
export async function saveFeedRow(db: Queryable, row: InstrumentFeedRow): Promise<void> {
  await db<InstrumentFeedRow>('instrument_feeds').insert(row).onConflict('instrument_id').merge();
}
