// Heartbeats from the agent on an instrument PC, and the feed state people read from them: alive
// while the agent keeps reporting, stale once it has been silent for AGENT_STALE_MINUTES.
import type { AppContext } from '../../context.ts';
import { nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import type { Instrument } from '../instruments/instruments.repository.ts';
import { listInstrumentRows } from '../instruments/instruments.repository.ts';
import { assertInstrumentAllowed, getInstrument } from '../instruments/instruments.service.ts';
import { findFeedRows, type InstrumentFeedRow, saveFeedRow } from './feeds.repository.ts';
import type { AgentHeartbeatRequestSchema, InstrumentFeedSchema } from './feeds.schemas.ts';

type Heartbeat = z.output<typeof AgentHeartbeatRequestSchema>;
type InstrumentFeed = z.input<typeof InstrumentFeedSchema>;

const asUtc = (iso: string) => new Date(iso).toISOString();

function feedOf(
  instrument: Pick<Instrument, 'id' | 'code'>,
  row: InstrumentFeedRow | undefined,
  staleAfterMinutes: number,
): InstrumentFeed {
  const silentMs = row ? Date.now() - Date.parse(row.reported_at) : Infinity;
  return {
    instrument: { id: instrument.id, code: instrument.code },
    state: !row ? 'no_agent' : silentMs > staleAfterMinutes * 60_000 ? 'stale' : 'alive',
    stale_after_minutes: staleAfterMinutes,
    reported_at: row?.reported_at ?? null,
    agent: row ? { version: row.agent_version, host: row.agent_host, reported_by: row.reported_by_label } : null,
    queue_length: row?.queue_length ?? null,
    last_success_at: row?.last_success_at ?? null,
    last_file: row?.last_file_name && row.last_file_at ? { name: row.last_file_name, at: row.last_file_at } : null,
    last_error: row?.last_error && row.last_error_at ? { message: row.last_error, at: row.last_error_at } : null,
  };
}

export async function recordHeartbeat(
  ctx: AppContext,
  auth: AuthContext,
  instrumentId: string,
  heartbeat: Heartbeat,
): Promise<InstrumentFeed> {
  assertInstrumentAllowed(auth, instrumentId);
  const instrument = await getInstrument(ctx, auth, instrumentId);
  const row: InstrumentFeedRow = {
    instrument_id: instrument.id,
    agent_version: heartbeat.agent_version,
    agent_host: heartbeat.host ?? null,
    queue_length: heartbeat.queue_length,
    last_success_at: heartbeat.last_success_at ? asUtc(heartbeat.last_success_at) : null,
    last_file_name: heartbeat.last_file?.name ?? null,
    last_file_at: heartbeat.last_file ? asUtc(heartbeat.last_file.at) : null,
    last_error: heartbeat.last_error?.message ?? null,
    last_error_at: heartbeat.last_error ? asUtc(heartbeat.last_error.at) : null,
    reported_at: nowIso(),
    reported_by_label: auth.label,
    stale_alerted_at: null,
  };
  await saveFeedRow(ctx.db, row);
  return feedOf(instrument, row, ctx.config.agentStaleMinutes);
}

export async function getFeed(ctx: AppContext, auth: AuthContext, instrumentId: string): Promise<InstrumentFeed> {
  const instrument = await getInstrument(ctx, auth, instrumentId);
  const [row] = await findFeedRows(ctx.db, [instrument.id]);
  return feedOf(instrument, row, ctx.config.agentStaleMinutes);
}

/** Every instrument the caller may see, ordered by code, with its feed. */
export async function listFeeds(ctx: AppContext, auth: AuthContext): Promise<InstrumentFeed[]> {
  const instruments: Instrument[] = [];
  let cursor: string | undefined;
  do {
    const page = await listInstrumentRows(ctx.db, { onlyIds: auth.instrumentIds }, { limit: 200, cursor });
    instruments.push(...page.data);
    cursor = page.next_cursor ?? undefined;
  } while (cursor);
  const rows = new Map(
    (
      await findFeedRows(
        ctx.db,
        instruments.map((i) => i.id),
      )
    ).map((row) => [row.instrument_id, row]),
  );
  return instruments.map((instrument) => feedOf(instrument, rows.get(instrument.id), ctx.config.agentStaleMinutes));
}
