// User rules: invitations, role and status changes (never leaving the lab without an admin),
// password resets. Every change is audited in the same transaction.
import type { AppContext } from '../../context.ts';
import { ConflictProblem, NotFoundProblem, UnauthorizedProblem, UnprocessableProblem } from '../../lib/problems.ts';
import { newId } from '../../lib/ids.ts';
import { nowIso } from '../../lib/time.ts';
import { invitationMail, passwordResetMail } from '../../mail/templates.ts';
import type { MailOutcome } from '../../mail/mailer.ts';
import { type Actor, SYSTEM_ACTOR } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { Role } from '../auth/scopes.ts';
import { hashPassword } from './passwords.ts';
import { consumeToken, issueToken } from './tokens.repository.ts';
import {
  countActiveAdmins,
  emailKey,
  findUserByEmail,
  findUserById,
  insertUser,
  listUserRows,
  toUser,
  updateUserRow,
  type User,
  type UserRow,
  type UserStatus,
} from './users.repository.ts';
import { inTransaction } from '../../db/transaction.ts';
import { revokeUserSessions } from '../auth/sessions.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';
import type { UserListQuerySchema } from './users.schemas.ts';

interface Audited {
  actor: Actor;
  requestId?: string;
}

export async function listUsersPage(ctx: AppContext, query: z.output<typeof UserListQuerySchema>): Promise<Page<User>> {
  return mapPage(await listUserRows(ctx.db, { role: query.role, status: query.status }, query), toUser);
}

/** The signed-in caller; 401 when the user behind the session or key no longer exists. */
export async function getCaller(ctx: AppContext, auth: AuthContext): Promise<User> {
  const row = await findUserById(ctx.db, auth.userId);
  if (!row) throw new UnauthorizedProblem();
  return toUser(row);
}

export async function getUser(ctx: AppContext, id: string): Promise<User> {
  const row = await findUserById(ctx.db, id);
  if (!row) throw new NotFoundProblem(`No user ${id}.`);
  return toUser(row);
}

export async function inviteUser(
  ctx: AppContext,
  input: { email: string; name: string; role: Role },
  by: Audited,
): Promise<{ user: User; invitation_mail: MailOutcome }> {
  const now = nowIso();
  const row: UserRow = {
    id: newId('usr'),
    email: input.email.trim(),
    email_key: emailKey(input.email),
    name: input.name,
    role: input.role,
    status: 'invited',
    password_hash: null,
    created_at: now,
    updated_at: now,
    last_login_at: null,
  };
  const token = await inTransaction(ctx.db, async (trx) => {
    if (await findUserByEmail(trx, input.email)) {
      throw new ConflictProblem(`A user with the e-mail ${input.email} already exists.`);
    }
    await insertUser(trx, row);
    await recordAudit(trx, { ...by, action: 'user.invited', targetType: 'user', targetId: row.id, after: toUser(row) });
    return issueToken(trx, row.id, 'invitation');
  });
  const mail = await sendInvitation(ctx, row, token, by.actor.label);
  return { user: toUser(row), invitation_mail: mail };
}

export async function resendInvitation(ctx: AppContext, id: string, by: Audited): Promise<MailOutcome> {
  const row = await findUserById(ctx.db, id);
  if (!row) throw new NotFoundProblem(`No user ${id}.`);
  if (row.status !== 'invited') throw new ConflictProblem('Only an invited user who has not accepted yet can be sent a new invitation.');
  const token = await inTransaction(ctx.db, async (trx) => {
    await recordAudit(trx, { ...by, action: 'user.invitation_resent', targetType: 'user', targetId: id });
    return issueToken(trx, id, 'invitation');
  });
  return sendInvitation(ctx, row, token, by.actor.label);
}

function sendInvitation(ctx: AppContext, row: UserRow, token: string, inviter: string): Promise<MailOutcome> {
  const link = `${ctx.config.publicUrl}/accept-invitation?token=${encodeURIComponent(token)}`;
  return ctx.mailer.send(invitationMail(row.email, row.name, inviter, link));
}

export async function updateUser(
  ctx: AppContext,
  id: string,
  changes: { name?: string; role?: Role; status?: Exclude<UserStatus, 'invited'> },
  by: Audited,
): Promise<User> {
  return inTransaction(ctx.db, async (trx) => {
    const before = await findUserById(trx, id);
    if (!before) throw new NotFoundProblem(`No user ${id}.`);
    if (changes.status && before.status === 'invited') {
      throw new ConflictProblem('An invited user becomes active by accepting the invitation.');
    }
    const after: UserRow = { ...before, ...changes, updated_at: nowIso() };
    const losesAdmin = before.role === 'admin' && before.status === 'active' && (after.role !== 'admin' || after.status !== 'active');
    if (losesAdmin && (await countActiveAdmins(trx)) <= 1) {
      throw new ConflictProblem('This is the last active admin; make another user admin first.');
    }
    await updateUserRow(trx, id, { name: after.name, role: after.role, status: after.status, updated_at: after.updated_at });
    if (after.status === 'disabled' || after.role !== before.role) {
      // Sessions carry the role's scopes; end them so the change takes effect at once.
      await revokeUserSessions(trx, id, after.updated_at);
    }
    await recordAudit(trx, {
      ...by,
      action: 'user.updated',
      targetType: 'user',
      targetId: id,
      before: toUser(before),
      after: toUser(after),
    });
    return toUser(after);
  });
}

export async function acceptInvitation(ctx: AppContext, token: string, password: string, requestId?: string): Promise<User> {
  const passwordHash = await hashPassword(password);
  return inTransaction(ctx.db, async (trx) => {
    const userId = await consumeToken(trx, token, 'invitation');
    const row = userId ? await findUserById(trx, userId) : undefined;
    if (!row || row.status !== 'invited') {
      throw new UnprocessableProblem('This invitation link is unknown, used or expired. Ask an admin to send a new one.');
    }
    const updated_at = nowIso();
    await updateUserRow(trx, row.id, { status: 'active', password_hash: passwordHash, updated_at });
    const actor: Actor = { type: 'user', id: row.id, label: row.email };
    await recordAudit(trx, { actor, requestId, action: 'user.invitation_accepted', targetType: 'user', targetId: row.id });
    return toUser({ ...row, status: 'active', updated_at });
  });
}

/** Always succeeds from the caller's point of view, so it cannot be used to probe e-mails. */
export async function requestPasswordReset(ctx: AppContext, email: string, requestId?: string): Promise<void> {
  const row = await findUserByEmail(ctx.db, email);
  if (!row || row.status !== 'active') return;
  const token = await inTransaction(ctx.db, async (trx) => {
    await recordAudit(trx, {
      actor: SYSTEM_ACTOR,
      requestId,
      action: 'user.password_reset_requested',
      targetType: 'user',
      targetId: row.id,
    });
    return issueToken(trx, row.id, 'password_reset');
  });
  const link = `${ctx.config.publicUrl}/reset-password?token=${encodeURIComponent(token)}`;
  await ctx.mailer.send(passwordResetMail(row.email, link));
}

export async function confirmPasswordReset(ctx: AppContext, token: string, password: string, requestId?: string): Promise<void> {
  const passwordHash = await hashPassword(password);
  await inTransaction(ctx.db, async (trx) => {
    const userId = await consumeToken(trx, token, 'password_reset');
    const row = userId ? await findUserById(trx, userId) : undefined;
    if (!row || row.status !== 'active') {
      throw new UnprocessableProblem('This reset link is unknown, used or expired. Ask for a new one.');
    }
    const now = nowIso();
    await updateUserRow(trx, row.id, { password_hash: passwordHash, updated_at: now });
    await revokeUserSessions(trx, row.id, now);
    const actor: Actor = { type: 'user', id: row.id, label: row.email };
    await recordAudit(trx, { actor, requestId, action: 'user.password_reset', targetType: 'user', targetId: row.id });
  });
}

/** CLI bootstrap: creates an active admin, or makes an existing user an active admin with this password. */
export async function ensureAdmin(
  ctx: Pick<AppContext, 'db'>,
  email: string,
  password: string,
  name = 'Administrator',
): Promise<{ user: User; created: boolean }> {
  const passwordHash = await hashPassword(password);
  return inTransaction(ctx.db, async (trx) => {
    const existing = await findUserByEmail(trx, email);
    const now = nowIso();
    if (existing) {
      const changes = { role: 'admin' as const, status: 'active' as const, password_hash: passwordHash, updated_at: now };
      await updateUserRow(trx, existing.id, changes);
      await recordAudit(trx, {
        actor: SYSTEM_ACTOR,
        action: 'user.admin_bootstrapped',
        targetType: 'user',
        targetId: existing.id,
        before: toUser(existing),
        after: toUser({ ...existing, ...changes }),
      });
      return { user: toUser({ ...existing, ...changes }), created: false };
    }
    const row: UserRow = {
      id: newId('usr'),
      email: email.trim(),
      email_key: emailKey(email),
      name,
      role: 'admin',
      status: 'active',
      password_hash: passwordHash,
      created_at: now,
      updated_at: now,
      last_login_at: null,
    };
    await insertUser(trx, row);
    await recordAudit(trx, {
      actor: SYSTEM_ACTOR,
      action: 'user.admin_bootstrapped',
      targetType: 'user',
      targetId: row.id,
      after: toUser(row),
    });
    return { user: toUser(row), created: true };
  });
}
