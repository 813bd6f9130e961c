// Read side of drift correction for one instrument: slope and offset of an element over time
// (one point per run), and the sets in force per method.
import type { AppContext } from '../../context.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { nowIso } from '../../lib/time.ts';
import { getInstrument } from '../instruments/instruments.service.ts';
import { inForceIds, toStandardizationView } from './standardization-view.ts';
import { type ElementCorrection, findSetInForce, listDriftRows, methodsWithActivatedSets } from './standardizations.repository.ts';

export async function driftHistory(
  ctx: AppContext,
  auth: AuthContext,
  instrumentId: string,
  query: { element: string; method_id?: string; since?: string; until?: string; limit: number },
) {
  const instrument = await getInstrument(ctx, auth, instrumentId);
  const iso = (t?: string) => (t ? new Date(t).toISOString() : undefined);
  const rows = await listDriftRows(ctx.db, {
    instrumentId,
    methodId: query.method_id,
    since: iso(query.since),
    until: iso(query.until),
    limit: query.limit,
  });
  const inForce = await inForceIds(ctx.db, rows);
  const points = rows.flatMap((row) => {
    const correction = (JSON.parse(row.corrections_json) as ElementCorrection[]).find((c) => c.element === query.element);
    if (!correction) return [];
    return [
      {
        standardization_id: row.id,
        method: { id: row.method_id, code: row.method_code },
        mode: row.mode,
        measured_at: row.measured_at,
        slope: correction.slope,
        offset: correction.offset,
        flag: correction.flag,
        reasons: correction.reasons,
        status: row.status,
        effective_from: row.effective_from,
        in_force: inForce.get(`${row.instrument_id}|${row.method_id}`) === row.id,
      },
    ];
  });
  return { instrument: { id: instrument.id, code: instrument.code }, element: query.element, points };
}

export async function correctionsInForce(ctx: AppContext, auth: AuthContext, instrumentId: string, at?: string) {
  const instrument = await getInstrument(ctx, auth, instrumentId);
  const time = at ? new Date(at).toISOString() : nowIso();
  const data = [];
  for (const methodId of await methodsWithActivatedSets(ctx.db, instrumentId)) {
    const row = await findSetInForce(ctx.db, instrumentId, methodId, time);
    if (!row) continue;
    const current = await findSetInForce(ctx.db, instrumentId, methodId, nowIso());
    data.push({ method: { id: row.method_id, code: row.method_code }, set: toStandardizationView(row, current?.id ?? null) });
  }
  data.sort((a, b) => a.method.code.localeCompare(b.method.code));
  return { instrument: { id: instrument.id, code: instrument.code }, at: time, data };
}
