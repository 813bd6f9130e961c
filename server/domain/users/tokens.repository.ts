// One-time tokens for invitations and password resets. The token itself goes by e-mail;
// only its SHA-256 is stored, so a database leak does not leak usable links.
import { newId } from '../../lib/ids.ts';
import { randomToken, sha256Hex } from '../../lib/secrets.ts';
import { addMinutes, nowIso } from '../../lib/time.ts';
import type { Queryable } from '../../db/transaction.ts';

export type TokenPurpose = 'invitation' | 'password_reset';

const TOKEN_LIFETIME_MINUTES: Record<TokenPurpose, number> = {
  invitation: 7 * 24 * 60,
  password_reset: 60,
};

interface TokenRow {
  id: string;
  user_id: string;
  purpose: TokenPurpose;
  token_hash: string;
  created_at: string;
  expires_at: string;
  used_at: string | null;
}

/** Issues a new token, retiring any unused token of the same purpose for that user. */
export async function issueToken(db: Queryable, userId: string, purpose: TokenPurpose): Promise<string> {
  const now = nowIso();
  await db<TokenRow>('user_tokens').where({ user_id: userId, purpose }).whereNull('used_at').update({ used_at: now });
  const token = randomToken();
  await db<TokenRow>('user_tokens').insert({
    id: newId('tok'),
    user_id: userId,
    purpose,
    token_hash: sha256Hex(token),
    created_at: now,
    expires_at: addMinutes(now, TOKEN_LIFETIME_MINUTES[purpose]),
    used_at: null,
  });
  return token;
}

/** Marks a valid token used and returns its user id; undefined when unknown, used or expired. */
export async function consumeToken(db: Queryable, token: string, purpose: TokenPurpose): Promise<string | undefined> {
  const now = nowIso();
  const row = await db<TokenRow>('user_tokens')
    .where({ token_hash: sha256Hex(token), purpose })
    .first();
  if (!row || row.used_at || row.expires_at <= now) return undefined;
  const updated = await db<TokenRow>('user_tokens').where({ id: row.id }).whereNull('used_at').update({ used_at: now });
  return updated === 1 ? row.user_id : undefined;
}
