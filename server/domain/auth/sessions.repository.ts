// The only code that touches the sessions table.
import type { Queryable } from '../../db/transaction.ts';

export interface SessionRow {
  id: string;
  user_id: string;
  created_at: string;
  last_seen_at: string;
  revoked_at: string | null;
  ip: string | null;
  user_agent: string | null;
}

export async function insertSession(db: Queryable, row: SessionRow): Promise<void> {
  await db<SessionRow>('sessions').insert(row);
}

export function findSession(db: Queryable, id: string, userId: string): Promise<SessionRow | undefined> {
  return db<SessionRow>('sessions').where({ id, user_id: userId }).first();
}

export async function touchSessionRow(db: Queryable, id: string, at: string): Promise<void> {
  await db<SessionRow>('sessions').where({ id }).update({ last_seen_at: at });
}

export async function revokeSession(db: Queryable, id: string, at: string): Promise<void> {
  await db<SessionRow>('sessions').where({ id }).whereNull('revoked_at').update({ revoked_at: at });
}

/** Ends every open session of a user (a role change, a disabled account, a new password). */
export async function revokeUserSessions(db: Queryable, userId: string, at: string): Promise<void> {
  await db<SessionRow>('sessions').where({ user_id: userId }).whereNull('revoked_at').update({ revoked_at: at });
}
