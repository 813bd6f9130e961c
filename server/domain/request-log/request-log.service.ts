// Who sees which entries, what an entry looks like in the API, and which entries can be replayed.
import type { AppContext } from '../../context.ts';
import { mapPage } from '../../lib/pagination.ts';
import { NotFoundProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import { recorderFor } from './recorder.ts';
import {
  findRequestLogRow,
  listRequestLogRows,
  type RequestLogFilters,
  type RequestLogRow,
  type RequestLogSummaryRow,
} from './request-log.repository.ts';

const API_BASE = '/api/v1';

/** Admins see every entry; everyone else their own calls and the calls of keys they created. */
function seesAllEntries(auth: AuthContext): boolean {
  return auth.role === 'admin' && !auth.instrumentIds;
}

/** A key restricted to instruments sees only its own calls: others' calls may concern other instruments. */
function onlyOwnCalls(auth: AuthContext): string | undefined {
  return auth.instrumentIds ? (auth.apiKeyId ?? auth.userId) : undefined;
}

function visible(auth: AuthContext, row: RequestLogRow): boolean {
  const caller = onlyOwnCalls(auth);
  if (caller && row.caller_id !== caller) return false;
  return seesAllEntries(auth) || row.owner_user_id === auth.userId;
}

function toSummary(row: RequestLogSummaryRow) {
  return {
    id: row.id,
    occurred_at: row.occurred_at,
    method: row.method,
    path: row.path,
    query: row.query,
    status: row.status,
    duration_ms: row.duration_ms,
    caller: { type: row.caller_type, id: row.caller_id, label: row.caller_label },
    request_id: row.request_id,
    replay_of: row.replay_of,
    from_console: Boolean(row.from_console),
  };
}

/** Null when the entry can be sent again; otherwise the reason, in words for the caller. */
export function notReplayableReason(row: RequestLogRow, bodyLimit: number): string | null {
  if (!row.path.startsWith(`${API_BASE}/`)) return `Only calls to ${API_BASE} can be replayed here.`;
  if (row.path.startsWith(`${API_BASE}/auth/`)) return 'Sign-in and session calls are not replayed: they would act on your own session.';
  if (/\/request-log\/[^/]+\/replay$/.test(row.path)) return 'This entry is itself a replay request; replay the original entry instead.';
  switch (row.request_body_kind) {
    case 'multipart':
      return 'Multipart uploads are not kept in the log (only their file names and sizes), so this call cannot be sent again.';
    case 'binary':
      return 'The binary request body is not kept in the log, so this call cannot be sent again.';
    case 'unread':
      return 'The request body was never read (the call failed before it), so it is not in the log and the call cannot be sent again.';
    default:
  }
  if (row.request_body_truncated)
    return `The request body (${row.request_body_size} bytes) was longer than the log keeps (${bodyLimit} bytes), so it cannot be sent again.`;
  if (row.request_redacted)
    return 'Secrets (a password, token or API key) were removed from the logged request, so it cannot be sent again as it was.';
  return null;
}

function parseHeaders(json: string): Record<string, string> {
  return JSON.parse(json) as Record<string, string>;
}

export function toEntry(row: RequestLogRow, bodyLimit: number) {
  const reason = notReplayableReason(row, bodyLimit);
  return {
    ...toSummary(row),
    request: {
      headers: parseHeaders(row.request_headers_json),
      content_type: row.request_content_type,
      body_kind: row.request_body_kind,
      body: row.request_body,
      body_size: row.request_body_size,
      body_truncated: row.request_body_truncated,
    },
    response: {
      headers: parseHeaders(row.response_headers_json),
      content_type: row.response_content_type,
      body_kind: row.response_body_kind,
      body: row.response_body,
      body_size: row.response_body_size,
      body_truncated: row.response_body_truncated,
    },
    replayable: reason === null,
    not_replayable_reason: reason,
  };
}

export async function getVisibleEntry(ctx: AppContext, auth: AuthContext, id: string): Promise<RequestLogRow> {
  await recorderFor(ctx).drain();
  const row = await findRequestLogRow(ctx.db, id);
  if (!row || !visible(auth, row)) throw new NotFoundProblem(`No request log entry ${id}.`);
  return row;
}

export interface ListQuery {
  limit: number;
  cursor?: string;
  method?: string;
  status?: string;
  path_prefix?: string;
  caller_id?: string;
  since?: string;
  until?: string;
  include_console?: boolean;
}

function statusFilter(status: string | undefined): RequestLogFilters['status'] {
  if (!status) return undefined;
  if (/xx$/i.test(status)) {
    const from = Number(status[0]) * 100;
    return [from, from + 100];
  }
  return Number(status);
}

export async function listEntries(ctx: AppContext, auth: AuthContext, query: ListQuery) {
  // Calls that finished before this one are listed even if their entry is still being written.
  await recorderFor(ctx).drain();
  const filters = {
    ownerUserId: seesAllEntries(auth) ? undefined : auth.userId,
    method: query.method,
    status: statusFilter(query.status),
    pathPrefix: query.path_prefix,
    callerId: query.caller_id,
    onlyCallerId: onlyOwnCalls(auth),
    since: query.since,
    until: query.until,
    includeConsole: query.include_console,
  };
  return mapPage(await listRequestLogRows(ctx.db, filters, query), toSummary);
}
