// The only code that touches the audit_events table. Events are appended, never updated.
import { newId } from '../../lib/ids.ts';
import { parseJsonColumn, toJsonColumn } from '../../lib/json.ts';
import { nowIso } from '../../lib/time.ts';
import type { Actor } from './actor.ts';
import { type KeysetColumn, keysetPage, type PageRequest } from '../../db/keyset.ts';
import { mapPage } from '../../lib/pagination.ts';
import type { Queryable } from '../../db/transaction.ts';

export interface AuditInput {
  actor: Actor;
  action: string;
  targetType: string;
  targetId?: string | null;
  before?: unknown;
  after?: unknown;
  requestId?: string;
}

interface AuditRow {
  id: string;
  occurred_at: string;
  actor_type: Actor['type'];
  actor_id: string | null;
  actor_label: string;
  action: string;
  target_type: string;
  target_id: string | null;
  before_json: string | null;
  after_json: string | null;
  request_id: string | null;
}

export interface AuditFilters {
  actorId?: string;
  /** A second actor condition the reader cannot lift. */
  onlyActorId?: string;
  action?: string;
  targetType?: string;
  targetId?: string;
  since?: string;
  until?: string;
}

/** Records one audit event inside the caller's transaction, so the change and its record land together. */
export async function recordAudit(db: Queryable, input: AuditInput): Promise<void> {
  await db('audit_events').insert({
    id: newId('aud'),
    occurred_at: nowIso(),
    actor_type: input.actor.type,
    actor_id: input.actor.id,
    actor_label: input.actor.label,
    action: input.action,
    target_type: input.targetType,
    target_id: input.targetId ?? null,
    before_json: toJsonColumn(input.before),
    after_json: toJsonColumn(input.after),
    request_id: input.requestId ?? null,
  });
}

const AUDIT_KEYSET: KeysetColumn<AuditRow>[] = [
  { column: 'occurred_at', order: 'desc', key: 'occurred_at', valueOf: (row) => row.occurred_at },
  { column: 'id', order: 'desc', key: 'id', valueOf: (row) => row.id },
];

function toAuditEvent(row: AuditRow) {
  return {
    id: row.id,
    occurred_at: row.occurred_at,
    actor: { type: row.actor_type, id: row.actor_id, label: row.actor_label },
    action: row.action,
    target: { type: row.target_type, id: row.target_id },
    before: parseJsonColumn<unknown>(row.before_json),
    after: parseJsonColumn<unknown>(row.after_json),
    request_id: row.request_id,
  };
}

/** Newest first. */
export async function listAudit(db: Queryable, filters: AuditFilters, page: PageRequest) {
  const query = db<AuditRow>('audit_events');
  if (filters.actorId) query.where('actor_id', filters.actorId);
  if (filters.onlyActorId) query.where('actor_id', filters.onlyActorId);
  if (filters.action) query.where('action', filters.action);
  if (filters.targetType) query.where('target_type', filters.targetType);
  if (filters.targetId) query.where('target_id', filters.targetId);
  if (filters.since) query.where('occurred_at', '>=', filters.since);
  if (filters.until) query.where('occurred_at', '<', filters.until);
  return mapPage(await keysetPage(query, AUDIT_KEYSET, page), toAuditEvent);
}
