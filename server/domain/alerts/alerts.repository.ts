// The only code that touches alert_preferences and pending_alerts.
import type { Queryable } from '../../db/transaction.ts';

export interface AlertPreferenceRow {
  user_id: string;
  kind: string;
  instrument_id: string | null;
}

export interface PendingAlertRow {
  id: string;
  user_id: string;
  kind: string;
  instrument_id: string | null;
  subject: string;
  body: string;
  path: string;
  created_at: string;
  sent_at: string | null;
}

export function preferencesOf(db: Queryable, userId: string): Promise<AlertPreferenceRow[]> {
  return db<AlertPreferenceRow>('alert_preferences').where({ user_id: userId }).orderBy(['kind', 'instrument_id']);
}

export async function replacePreferences(db: Queryable, userId: string, rows: AlertPreferenceRow[]): Promise<void> {
  await db('alert_preferences').where({ user_id: userId }).delete();
  if (rows.length) await db<AlertPreferenceRow>('alert_preferences').insert(rows);
}

/** Active users who asked for this kind, for this instrument or all. */
export function subscribersOf(db: Queryable, kind: string, instrumentId: string | null): Promise<{ user_id: string }[]> {
  return db('alert_preferences as p')
    .join('users as u', 'u.id', 'p.user_id')
    .where('p.kind', kind)
    .where('u.status', 'active')
    .where((q) => {
      q.whereNull('p.instrument_id');
      if (instrumentId) q.orWhere('p.instrument_id', instrumentId);
    })
    .distinct('p.user_id');
}

export async function insertPendingAlerts(db: Queryable, rows: PendingAlertRow[]): Promise<void> {
  if (rows.length) await db<PendingAlertRow>('pending_alerts').insert(rows);
}

export function unsentAlerts(db: Queryable): Promise<(PendingAlertRow & { email: string })[]> {
  return db('pending_alerts as a')
    .join('users as u', 'u.id', 'a.user_id')
    .whereNull('a.sent_at')
    .orderBy([{ column: 'a.created_at' }, { column: 'a.id' }])
    .select('a.*', 'u.email');
}

export async function markSent(db: Queryable, ids: string[], at: string): Promise<void> {
  await db('pending_alerts').whereIn('id', ids).update({ sent_at: at });
}
