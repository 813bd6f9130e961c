// Issue, list, revoke and roll API keys. A caller grants only scopes it holds itself;
// non-admins see and manage only the keys they created.
import type { AppContext } from '../../context.ts';
import { NotFoundProblem, ConflictProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { newId } from '../../lib/ids.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { nowIso } from '../../lib/time.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { type ApiKey, type ApiKeyRow, findApiKey, insertApiKey, listApiKeyRows, toApiKey, updateApiKey } from './api-keys.repository.ts';
import type { ApiKeyListQuerySchema, CreateApiKeyRequestSchema } from './api-keys.schemas.ts';
import { displayPrefix, generateKeySecret } from './key-format.ts';
import { boundByCaller } from './key-bounds.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { mapPage, type Page } from '../../lib/pagination.ts';
import type { z } from '../../lib/zod.ts';

export type NewKeyInput = z.output<typeof CreateApiKeyRequestSchema>;

function canManageAllKeys(auth: AuthContext): boolean {
  return auth.role === 'admin' && auth.kind === 'session';
}

/** Admins (signed in) see every key; everyone else the keys they created. */
export async function listApiKeysPage(
  ctx: AppContext,
  auth: AuthContext,
  query: z.output<typeof ApiKeyListQuerySchema>,
): Promise<Page<ApiKey>> {
  const filters = { createdBy: canManageAllKeys(auth) ? undefined : auth.userId, includeRevoked: query.include_revoked };
  const now = nowIso();
  return mapPage(await listApiKeyRows(ctx.db, filters, query), (row) => toApiKey(row, now));
}

async function loadManageable(db: Queryable, auth: AuthContext, id: string) {
  const row = await findApiKey(db, id);
  if (!row || (!canManageAllKeys(auth) && row.created_by !== auth.userId)) throw new NotFoundProblem(`No API key ${id}.`);
  return row;
}

function newKeyRow(input: NewKeyInput, createdBy: string, now: string): { row: ApiKeyRow; secret: string } {
  const secret = generateKeySecret();
  return {
    secret,
    row: {
      id: newId('key'),
      name: input.name,
      prefix: displayPrefix(secret),
      secret_hash: sha256Hex(secret),
      scopes_json: JSON.stringify(input.scopes),
      instrument_ids_json: input.instrument_ids ? JSON.stringify(input.instrument_ids) : null,
      created_by: createdBy,
      created_at: now,
      expires_at: input.expires_at ? new Date(input.expires_at).toISOString() : null,
      revoked_at: null,
      last_used_at: null,
      replaced_by: null,
    },
  };
}

export async function createApiKey(
  ctx: AppContext,
  auth: AuthContext,
  input: NewKeyInput,
  requestId?: string,
): Promise<ApiKey & { secret: string }> {
  const { row, secret } = newKeyRow(boundByCaller(auth, input, { inherit: true }), auth.userId, nowIso());
  await inTransaction(ctx.db, async (trx) => {
    await insertApiKey(trx, row);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'api_key.created',
      targetType: 'api_key',
      targetId: row.id,
      after: toApiKey(row),
    });
  });
  return { ...toApiKey({ ...row, created_by_email: auth.email }), secret };
}

export async function getApiKey(ctx: AppContext, auth: AuthContext, id: string): Promise<ApiKey> {
  return toApiKey(await loadManageable(ctx.db, auth, id));
}

export async function revokeApiKey(ctx: AppContext, auth: AuthContext, id: string, requestId?: string): Promise<void> {
  await inTransaction(ctx.db, async (trx) => {
    const row = await loadManageable(trx, auth, id);
    if (row.revoked_at) return;
    const revoked_at = nowIso();
    await updateApiKey(trx, id, { revoked_at });
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'api_key.revoked',
      targetType: 'api_key',
      targetId: id,
      before: toApiKey(row),
      after: toApiKey({ ...row, revoked_at }),
    });
  });
}

export async function rollApiKey(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  overlapMinutes: number,
  requestId?: string,
): Promise<ApiKey & { secret: string; previous: { id: string; expires_at: string } }> {
  const old = await loadManageable(ctx.db, auth, id);
  const current = toApiKey(old);
  if (current.status !== 'active') throw new ConflictProblem(`Only an active key can be rolled; this one is ${current.status}.`);
  const grant = {
    name: old.name,
    scopes: current.scopes,
    instrument_ids: current.instrument_ids ?? undefined,
    expires_at: old.expires_at ?? undefined,
  };
  const now = nowIso();
  const { row, secret } = newKeyRow(boundByCaller(auth, grant, { inherit: false }), auth.userId, now);
  const overlapEnd = new Date(Date.now() + overlapMinutes * 60_000).toISOString();
  const oldExpiry = old.expires_at && old.expires_at < overlapEnd ? old.expires_at : overlapEnd;
  await inTransaction(ctx.db, async (trx) => {
    await insertApiKey(trx, row);
    await updateApiKey(trx, id, { expires_at: oldExpiry, replaced_by: row.id });
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'api_key.rolled',
      targetType: 'api_key',
      targetId: id,
      before: current,
      after: { ...current, expires_at: oldExpiry, replaced_by: row.id },
    });
  });
  return { ...toApiKey({ ...row, created_by_email: auth.email }), secret, previous: { id, expires_at: oldExpiry } };
}
