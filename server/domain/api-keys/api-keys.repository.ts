// The only code that touches the api_keys table.
import { parseJsonColumn } from '../../lib/json.ts';
import type { Scope } from '../auth/scopes.ts';
import type { Queryable } from '../../db/transaction.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Page } from '../../lib/pagination.ts';

export interface ApiKeyRow {
  id: string;
  name: string;
  prefix: string;
  secret_hash: string;
  scopes_json: string;
  instrument_ids_json: string | null;
  created_by: string;
  created_at: string;
  expires_at: string | null;
  revoked_at: string | null;
  last_used_at: string | null;
  replaced_by: string | null;
}

export function toApiKey(row: ApiKeyRow & { created_by_email?: string | null }, now = new Date().toISOString()) {
  const expired = row.expires_at !== null && row.expires_at <= now;
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    scopes: parseJsonColumn<Scope[]>(row.scopes_json) ?? [],
    instrument_ids: parseJsonColumn<string[]>(row.instrument_ids_json),
    created_by: { id: row.created_by, email: row.created_by_email ?? null },
    created_at: row.created_at,
    expires_at: row.expires_at,
    revoked_at: row.revoked_at,
    last_used_at: row.last_used_at,
    replaced_by: row.replaced_by,
    status: row.revoked_at ? ('revoked' as const) : expired ? ('expired' as const) : ('active' as const),
  };
}

export type ApiKey = ReturnType<typeof toApiKey>;

export async function insertApiKey(db: Queryable, row: ApiKeyRow): Promise<void> {
  await db<ApiKeyRow>('api_keys').insert(row);
}

export function findApiKeyByHash(db: Queryable, secretHash: string): Promise<ApiKeyRow | undefined> {
  return db<ApiKeyRow>('api_keys').where({ secret_hash: secretHash }).first();
}

export function findApiKey(db: Queryable, id: string) {
  return db<ApiKeyRow>('api_keys')
    .leftJoin('users', 'users.id', 'api_keys.created_by')
    .select<(ApiKeyRow & { created_by_email: string | null })[]>('api_keys.*', 'users.email as created_by_email')
    .where('api_keys.id', id)
    .first();
}

export async function updateApiKey(db: Queryable, id: string, changes: Partial<ApiKeyRow>): Promise<void> {
  await db<ApiKeyRow>('api_keys').where({ id }).update(changes);
}

type ApiKeyListRow = ApiKeyRow & { created_by_email: string | null };

const API_KEY_KEYSET: KeysetColumn<ApiKeyListRow>[] = [{ column: 'api_keys.id', order: 'desc', key: 'id', valueOf: (row) => row.id }];

/** Newest first (ids sort by creation time). */
export function listApiKeyRows(
  db: Queryable,
  filters: { createdBy?: string; includeRevoked: boolean },
  page: PageRequest,
): Promise<Page<ApiKeyListRow>> {
  const query = db<ApiKeyRow>('api_keys')
    .leftJoin('users', 'users.id', 'api_keys.created_by')
    .select('api_keys.*', 'users.email as created_by_email');
  if (filters.createdBy) query.where('api_keys.created_by', filters.createdBy);
  if (!filters.includeRevoked) query.whereNull('api_keys.revoked_at');
  return keysetPage(query, API_KEY_KEYSET, page);
}
