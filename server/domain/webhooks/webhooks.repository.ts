// The only code that touches the webhook_endpoints table.
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import type { Queryable } from '../../db/transaction.ts';
import type { Page } from '../../lib/pagination.ts';

export interface WebhookEndpointRow {
  id: string;
  url: string;
  description: string | null;
  event_types_json: string;
  enabled: boolean | number;
  disabled_reason: string | null;
  secret: string;
  previous_secret: string | null;
  previous_secret_expires_at: string | null;
  failing_since: string | null;
  owner_user_id: string | null;
  created_by_label: string;
  created_at: string;
  updated_at: string;
}

export async function insertEndpoint(db: Queryable, row: WebhookEndpointRow): Promise<void> {
  await db<WebhookEndpointRow>('webhook_endpoints').insert(row);
}

export function findEndpoint(db: Queryable, id: string): Promise<WebhookEndpointRow | undefined> {
  return db<WebhookEndpointRow>('webhook_endpoints').where({ id }).first();
}

export function findEndpoints(db: Queryable, ids: string[]): Promise<WebhookEndpointRow[]> {
  return db<WebhookEndpointRow>('webhook_endpoints').whereIn('id', ids);
}

export async function updateEndpointRow(db: Queryable, id: string, changes: Partial<WebhookEndpointRow>): Promise<void> {
  await db<WebhookEndpointRow>('webhook_endpoints').where({ id }).update(changes);
}

export async function deleteEndpointRow(db: Queryable, id: string): Promise<void> {
  await db('webhook_endpoints').where({ id }).delete();
}

const ENDPOINT_KEYSET: KeysetColumn<WebhookEndpointRow>[] = [{ column: 'id', order: 'desc', key: 'id', valueOf: (row) => row.id }];

/** Newest first (ids sort by creation time). */
export function listEndpointRows(db: Queryable, page: PageRequest): Promise<Page<WebhookEndpointRow>> {
  return keysetPage(db<WebhookEndpointRow>('webhook_endpoints').select('*'), ENDPOINT_KEYSET, page);
}

/** Enabled endpoints, for matching events to subscribers. */
export function listEnabledEndpoints(db: Queryable): Promise<WebhookEndpointRow[]> {
  return db<WebhookEndpointRow>('webhook_endpoints').where({ enabled: true }).orderBy('id');
}
