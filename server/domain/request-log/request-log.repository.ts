// The only code that touches the request_log table. Rows are appended, read and aged out.
import type { BodyKind } from './body-kinds.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import { bulkInsert } from '../../db/bulk-insert.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import type { Page } from '../../lib/pagination.ts';

export interface RequestLogRow {
  id: string;
  occurred_at: string;
  method: string;
  path: string;
  query: string;
  status: number;
  duration_ms: number;
  caller_type: 'user' | 'api_key' | 'anonymous';
  caller_id: string | null;
  caller_label: string | null;
  owner_user_id: string | null;
  request_id: string;
  request_headers_json: string;
  request_content_type: string | null;
  request_body_kind: BodyKind;
  request_body: string | null;
  request_body_size: number;
  request_body_truncated: boolean;
  request_redacted: boolean;
  response_headers_json: string;
  response_content_type: string | null;
  response_body_kind: BodyKind;
  response_body: string | null;
  response_body_size: number;
  response_body_truncated: boolean;
  replay_of: string | null;
  /** A call the console made for its own pages (see server/http/request-log.ts). */
  from_console: boolean;
}

export interface RequestLogFilters {
  /** Only entries of this user (their own calls and their keys' calls); undefined = everyone's. */
  ownerUserId?: string;
  method?: string;
  /** An exact status, or a class given as [from, to). */
  status?: number | [number, number];
  pathPrefix?: string;
  callerId?: string;
  /** A second caller condition the viewer cannot lift (a restricted key sees only its own calls). */
  onlyCallerId?: string;
  since?: string;
  until?: string;
  /** Also list the console's own calls (left out by default). */
  includeConsole?: boolean;
}

const SUMMARY_COLUMNS = [
  'id',
  'occurred_at',
  'method',
  'path',
  'query',
  'status',
  'duration_ms',
  'caller_type',
  'caller_id',
  'caller_label',
  'request_id',
  'replay_of',
  'from_console',
] as const;

export type RequestLogSummaryRow = Pick<RequestLogRow, (typeof SUMMARY_COLUMNS)[number]>;

function normalise(row: RequestLogRow): RequestLogRow {
  // SQLite hands booleans back as 0/1.
  return {
    ...row,
    request_body_truncated: Boolean(row.request_body_truncated),
    request_redacted: Boolean(row.request_redacted),
    response_body_truncated: Boolean(row.response_body_truncated),
    from_console: Boolean(row.from_console),
  };
}

export async function insertRequestLogRows(db: Queryable, rows: RequestLogRow[]): Promise<void> {
  await inTransaction(db, (trx) => bulkInsert(trx, 'request_log', rows as unknown as Record<string, unknown>[]));
}

export async function findRequestLogRow(db: Queryable, id: string): Promise<RequestLogRow | undefined> {
  const row = await db<RequestLogRow>('request_log').where({ id }).first();
  return row && normalise(row);
}

const REQUEST_LOG_KEYSET: KeysetColumn<RequestLogSummaryRow>[] = [{ column: 'id', order: 'desc', key: 'id', valueOf: (row) => row.id }];

/** Newest first (ids sort by time). */
export function listRequestLogRows(db: Queryable, filters: RequestLogFilters, page: PageRequest): Promise<Page<RequestLogSummaryRow>> {
  const query = db<RequestLogRow>('request_log').select(...SUMMARY_COLUMNS);
  if (filters.ownerUserId) query.where('owner_user_id', filters.ownerUserId);
  if (filters.method) query.where('method', filters.method);
  if (typeof filters.status === 'number') query.where('status', filters.status);
  else if (filters.status) query.where('status', '>=', filters.status[0]).andWhere('status', '<', filters.status[1]);
  // substr rather than LIKE: exact on SQLite and PostgreSQL alike, no wildcard escaping.
  if (filters.pathPrefix) query.whereRaw('substr(path, 1, ?) = ?', [filters.pathPrefix.length, filters.pathPrefix]);
  if (filters.callerId) query.where('caller_id', filters.callerId);
  if (filters.onlyCallerId) query.where('caller_id', filters.onlyCallerId);
  if (filters.since) query.where('occurred_at', '>=', filters.since);
  if (filters.until) query.where('occurred_at', '<', filters.until);
  if (!filters.includeConsole) query.where('from_console', false);
  return keysetPage(query, REQUEST_LOG_KEYSET, page);
}

/** Deletes entries that occurred before the cutoff; returns how many. */
export function deleteRequestLogBefore(db: Queryable, cutoff: string): Promise<number> {
  return db('request_log').where('occurred_at', '<', cutoff).delete();
}
