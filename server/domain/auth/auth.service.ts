// Sign-in, sign-out and turning a session cookie into the caller's AuthContext.
import type { AppContext } from '../../context.ts';
import { UnauthorizedProblem } from '../../lib/problems.ts';
import type { AuthContext } from './auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { verifyPassword } from '../users/passwords.ts';
import { findUserByEmail, findUserById, toUser, updateUserRow, type User, type UserRow } from '../users/users.repository.ts';
import { ROLE_SCOPES } from './scopes.ts';
import { SESSION_ABSOLUTE_HOURS } from './session-token.ts';
import { inTransaction } from '../../db/transaction.ts';
import { findSession, insertSession, revokeSession, touchSessionRow } from './sessions.repository.ts';

const INVALID_LOGIN = 'The e-mail or password is not correct.';

export async function login(
  ctx: AppContext,
  input: { email: string; password: string; ip?: string; userAgent?: string; requestId?: string },
): Promise<{ sessionId: string; user: User }> {
  const row = await findUserByEmail(ctx.db, input.email);
  const passwordOk = await verifyPassword(input.password, row?.password_hash ?? null);
  // One answer for unknown e-mail, wrong password and disabled account: nothing to probe.
  if (!row || !passwordOk || row.status !== 'active') throw new UnauthorizedProblem(INVALID_LOGIN);
  const now = nowIso();
  const sessionId = newId('ses');
  await inTransaction(ctx.db, async (trx) => {
    await insertSession(trx, {
      id: sessionId,
      user_id: row.id,
      created_at: now,
      last_seen_at: now,
      revoked_at: null,
      ip: input.ip?.slice(0, 64) ?? null,
      user_agent: input.userAgent?.slice(0, 300) ?? null,
    });
    await updateUserRow(trx, row.id, { last_login_at: now });
    await recordAudit(trx, {
      actor: { type: 'user', id: row.id, label: row.email },
      requestId: input.requestId,
      action: 'session.signed_in',
      targetType: 'session',
      targetId: sessionId,
    });
  });
  return { sessionId, user: toUser({ ...row, last_login_at: now }) };
}

export async function logout(ctx: AppContext, auth: AuthContext, requestId?: string): Promise<void> {
  if (!auth.sessionId) return;
  await inTransaction(ctx.db, async (trx) => {
    await revokeSession(trx, auth.sessionId!, nowIso());
    await recordAudit(trx, {
      actor: { type: 'user', id: auth.userId, label: auth.email },
      requestId,
      action: 'session.signed_out',
      targetType: 'session',
      targetId: auth.sessionId,
    });
  });
}

export function sessionAuthContext(user: Pick<UserRow, 'id' | 'email' | 'role'>, sessionId: string): AuthContext {
  return {
    kind: 'session',
    userId: user.id,
    email: user.email,
    role: user.role,
    scopes: ROLE_SCOPES[user.role],
    sessionId,
    label: user.email,
  };
}

/** The caller behind a session id, or undefined when the session or its user is no longer valid. */
export async function resolveSession(ctx: AppContext, sessionId: string, userId: string): Promise<AuthContext | undefined> {
  const session = await findSession(ctx.db, sessionId, userId);
  if (!session || session.revoked_at) return undefined;
  const absoluteEnd = Date.parse(session.created_at) + SESSION_ABSOLUTE_HOURS * 3600_000;
  if (Date.now() > absoluteEnd) return undefined;
  const user = await findUserById(ctx.db, userId);
  if (!user || user.status !== 'active') return undefined;
  return sessionAuthContext(user, session.id);
}

export async function touchSession(ctx: AppContext, sessionId: string): Promise<void> {
  await touchSessionRow(ctx.db, sessionId, nowIso());
}
