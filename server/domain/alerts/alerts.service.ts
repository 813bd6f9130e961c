// E-mail alerts: each user chooses which kinds of event mail them, for one instrument or all.
// An alert is recorded as pending in the transaction of its event; flushAlerts() sends each
// user's pending alerts as one message once the oldest is ALERT_GROUP_MINUTES old, so a burst
// of violations becomes one e-mail (a timer in start.ts calls it every minute).
import { startLeasedJob } from '../../cluster/job-lease.ts';
import type { AppContext } from '../../context.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { alertsMail } from '../../mail/templates.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { findInstrument } from '../instruments/instruments.repository.ts';
import { UnprocessableProblem } from '../../lib/problems.ts';
import { insertPendingAlerts, markSent, preferencesOf, replacePreferences, subscribersOf, unsentAlerts } from './alerts.repository.ts';

export const ALERT_KINDS = {
  out_of_spec: 'A sample does not conform to its grade',
  control_out_of_control: 'A control point breaks a run rule',
  standardization_flagged: 'A standardization run is flagged',
  webhook_disabled: 'A webhook endpoint was disabled after failed deliveries',
  feed_stale: "An instrument PC's agent has been silent for longer than AGENT_STALE_MINUTES",
} as const;
export type AlertKind = keyof typeof ALERT_KINDS;

export interface NewAlert {
  kind: AlertKind;
  instrumentId: string | null;
  subject: string;
  lines: string[];
  /** The console page, below PUBLIC_URL. */
  path: string;
}

/** Records the alert for every user who asked for it; runs in the caller's transaction. */
export async function queueAlert(db: Queryable, alert: NewAlert): Promise<void> {
  const users = await subscribersOf(db, alert.kind, alert.instrumentId);
  const now = new Date().toISOString();
  await insertPendingAlerts(
    db,
    users.map((u) => ({
      id: newId('alr'),
      user_id: u.user_id,
      kind: alert.kind,
      instrument_id: alert.instrumentId,
      subject: alert.subject,
      body: alert.lines.join('\n'),
      path: alert.path,
      created_at: now,
      sent_at: null,
    })),
  );
}

/** Sends, per user, every pending alert once the oldest is older than the window. Returns messages sent. */
export async function flushAlerts(ctx: Pick<AppContext, 'db' | 'config' | 'mailer'>, now = new Date()): Promise<number> {
  const cutoff = new Date(now.getTime() - ctx.config.alertGroupMinutes * 60_000).toISOString();
  const byUser = new Map<string, Awaited<ReturnType<typeof unsentAlerts>>>();
  for (const row of await unsentAlerts(ctx.db)) byUser.set(row.user_id, [...(byUser.get(row.user_id) ?? []), row]);
  let sent = 0;
  for (const alerts of byUser.values()) {
    if (alerts[0].created_at > cutoff) continue;
    const message = alertsMail(
      alerts[0].email,
      alerts.map((a) => ({ subject: a.subject, body: a.body, link: `${ctx.config.publicUrl}${a.path}`, at: a.created_at })),
    );
    const outcome = await ctx.mailer.send(message);
    if (!outcome.delivered) continue;
    await markSent(
      ctx.db,
      alerts.map((a) => a.id),
      now.toISOString(),
    );
    sent += 1;
  }
  return sent;
}

export async function getAlertPreferences(ctx: AppContext, auth: AuthContext) {
  const rows = await preferencesOf(ctx.db, auth.userId);
  return {
    data: rows.map((r) => ({ kind: r.kind as AlertKind, instrument_id: r.instrument_id })),
    group_minutes: ctx.config.alertGroupMinutes,
  };
}

export async function setAlertPreferences(
  ctx: AppContext,
  auth: AuthContext,
  input: { data: { kind: AlertKind; instrument_id: string | null }[] },
) {
  await inTransaction(ctx.db, async (trx) => {
    for (const [i, pref] of input.data.entries())
      if (pref.instrument_id && !(await findInstrument(trx, pref.instrument_id)))
        throw new UnprocessableProblem('An alert preference names an unknown instrument.', [
          { location: `body.data.${i}.instrument_id`, message: `no instrument ${pref.instrument_id}`, code: 'unknown_reference' },
        ]);
    const distinct = new Map(input.data.map((p) => [`${p.kind}|${p.instrument_id ?? ''}`, p]));
    await replacePreferences(
      trx,
      auth.userId,
      [...distinct.values()].map((p) => ({ user_id: auth.userId, kind: p.kind, instrument_id: p.instrument_id })),
    );
  });
  return getAlertPreferences(ctx, auth);
}

/** Starts the minute timer that flushes alerts; stop() ends it. One node flushes per interval, so no alert is mailed twice. */
export function startAlertFlusher(ctx: Pick<AppContext, 'db' | 'config' | 'mailer' | 'logger'>, intervalMs = 60_000) {
  return startLeasedJob(ctx, 'alert-flush', intervalMs, () => flushAlerts(ctx));
}
