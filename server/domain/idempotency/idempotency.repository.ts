// The only code that touches the idempotency_keys table.
import { isUniqueViolation } from '../../db/errors.ts';
import type { Queryable } from '../../db/transaction.ts';

export interface IdempotencyRow {
  caller: string;
  idempotency_key: string;
  fingerprint: string;
  method: string;
  path: string;
  state: 'in_flight' | 'done';
  status: number | null;
  response_headers_json: string | null;
  response_body_base64: string | null;
  body_withheld: boolean;
  created_at: string;
  locked_at: string;
  expires_at: string;
}

export interface ClaimInput {
  caller: string;
  key: string;
  fingerprint: string;
  method: string;
  path: string;
  now: Date;
  ttlMs: number;
  /** An in-flight claim older than this is taken to belong to a request that died with its process. */
  staleMs: number;
}

export type Claim = { kind: 'claimed' } | { kind: 'existing'; row: IdempotencyRow };

function normalise(row: IdempotencyRow): IdempotencyRow {
  // SQLite returns booleans as 0/1.
  return { ...row, body_withheld: Boolean(row.body_withheld) };
}

async function findIdempotencyRow(db: Queryable, caller: string, key: string): Promise<IdempotencyRow | undefined> {
  const row = await db<IdempotencyRow>('idempotency_keys').where({ caller, idempotency_key: key }).first();
  return row && normalise(row);
}

/** Takes the key for a new request, or returns the row that already holds it. */
export async function claimIdempotencyKey(db: Queryable, input: ClaimInput): Promise<Claim> {
  const now = input.now.toISOString();
  const staleBefore = new Date(input.now.getTime() - input.staleMs).toISOString();
  const where = { caller: input.caller, idempotency_key: input.key };
  await db('idempotency_keys')
    .where(where)
    .andWhere((q) => q.where('expires_at', '<=', now).orWhere((s) => s.where('state', 'in_flight').andWhere('locked_at', '<', staleBefore)))
    .delete();
  // Two attempts: the holder may finish and release the key between our insert and our read.
  for (let attempt = 0; attempt < 2; attempt++) {
    try {
      await db('idempotency_keys').insert({
        ...where,
        fingerprint: input.fingerprint,
        method: input.method,
        path: input.path,
        state: 'in_flight',
        status: null,
        response_headers_json: null,
        response_body_base64: null,
        body_withheld: false,
        created_at: now,
        locked_at: now,
        expires_at: new Date(input.now.getTime() + input.ttlMs).toISOString(),
      });
      return { kind: 'claimed' };
    } catch (error) {
      if (!isUniqueViolation(error)) throw error;
      const row = await findIdempotencyRow(db, input.caller, input.key);
      if (row) return { kind: 'existing', row };
    }
  }
  throw new Error('idempotency key could not be claimed');
}

export async function completeIdempotencyKey(
  db: Queryable,
  caller: string,
  key: string,
  response: { status: number; headers: Record<string, string>; body: Buffer | null },
): Promise<void> {
  await db('idempotency_keys')
    .where({ caller, idempotency_key: key, state: 'in_flight' })
    .update({
      state: 'done',
      status: response.status,
      response_headers_json: JSON.stringify(response.headers),
      response_body_base64: response.body ? response.body.toString('base64') : null,
      body_withheld: response.body === null,
    });
}

/** Keeps a running request's claim fresh: only a claim nobody renews goes stale. */
export async function renewIdempotencyClaim(db: Queryable, caller: string, key: string, now: Date): Promise<void> {
  await db('idempotency_keys').where({ caller, idempotency_key: key, state: 'in_flight' }).update({ locked_at: now.toISOString() });
}

/** Frees the key (the request failed with 5xx or never finished), so the client can retry. */
export async function releaseIdempotencyKey(db: Queryable, caller: string, key: string): Promise<void> {
  await db('idempotency_keys').where({ caller, idempotency_key: key, state: 'in_flight' }).delete();
}

export async function purgeExpiredIdempotencyKeys(db: Queryable, now: Date): Promise<number> {
  return db('idempotency_keys').where('expires_at', '<=', now.toISOString()).delete();
}
