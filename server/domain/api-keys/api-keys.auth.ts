// Turns a Bearer secret into the caller's AuthContext. Unknown, malformed, revoked and expired
// keys all get a 401; the detail says which, since the caller already holds the secret.
import type { AppContext } from '../../context.ts';
import { UnauthorizedProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { parseJsonColumn } from '../../lib/json.ts';
import { sha256Hex } from '../../lib/secrets.ts';
import { findUserById } from '../users/users.repository.ts';
import { ROLE_SCOPES, type Scope } from '../auth/scopes.ts';
import { findApiKeyByHash, updateApiKey } from './api-keys.repository.ts';
import { isWellFormedKey } from './key-format.ts';

/** last_used_at is written at most this often per key, to keep reads read-only. */
const LAST_USED_RESOLUTION_MS = 60_000;

export async function authenticateApiKey(ctx: AppContext, secret: string): Promise<AuthContext> {
  if (!isWellFormedKey(secret)) throw new UnauthorizedProblem('This is not a Meltwire API key (expected mw_live_… with a valid checksum).');
  const row = await findApiKeyByHash(ctx.db, sha256Hex(secret));
  if (!row) throw new UnauthorizedProblem('Unknown API key.');
  const now = new Date();
  if (row.revoked_at) throw new UnauthorizedProblem('This API key has been revoked.');
  if (row.expires_at && row.expires_at <= now.toISOString()) throw new UnauthorizedProblem('This API key has expired.');
  const owner = await findUserById(ctx.db, row.created_by);
  if (!owner || owner.status !== 'active')
    throw new UnauthorizedProblem('The user who issued this API key is disabled; its keys are suspended.');
  if (!row.last_used_at || now.getTime() - Date.parse(row.last_used_at) > LAST_USED_RESOLUTION_MS) {
    await updateApiKey(ctx.db, row.id, { last_used_at: now.toISOString() });
  }
  return {
    kind: 'api_key',
    userId: owner.id,
    email: owner.email,
    role: owner.role,
    // What the key was granted, cut down to what its owner's role holds now: a demotion takes effect at once.
    scopes: new Set((parseJsonColumn<Scope[]>(row.scopes_json) ?? []).filter((scope) => ROLE_SCOPES[owner.role].has(scope))),
    apiKeyId: row.id,
    keyExpiresAt: row.expires_at,
    instrumentIds: parseJsonColumn<string[]>(row.instrument_ids_json),
    label: `${row.name} (${row.prefix}…)`,
  };
}
