// The only code that touches the audit_events table. Events are appended, never updated.
import type { Knex } from 'knex';
import { newId } from '../../lib/ids.ts';
import { parseJsonColumn, toJsonColumn } from '../../lib/json.ts';
import { nowIso } from '../../lib/time.ts';
import type { Actor } from './actor.ts';

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
  actor_type: string;
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
  action?: string;
  targetType?: string;
  targetId?: string;
  since?: string;
  until?: string;
  after?: { occurred_at: string; id: string };
  limit: number;
}

/** Records one audit event inside the caller's transaction, so the change and its record land together. */
export async function recordAudit(db: Knex | Knex.Transaction, input: AuditInput): Promise<void> {
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

/** Newest first; fetches limit + 1 rows so the caller can tell whether there is a next page. */
export async function listAudit(db: Knex, filters: AuditFilters) {
  const query = db<AuditRow>('audit_events').orderBy([
    { column: 'occurred_at', order: 'desc' },
    { column: 'id', order: 'desc' },
  ]);
  if (filters.actorId) query.where('actor_id', filters.actorId);
  if (filters.action) query.where('action', filters.action);
  if (filters.targetType) query.where('target_type', filters.targetType);
  if (filters.targetId) query.where('target_id', filters.targetId);
  if (filters.since) query.where('occurred_at', '>=', filters.since);
  if (filters.until) query.where('occurred_at', '<', filters.until);
  if (filters.after) {
    const { occurred_at, id } = filters.after;
    query.where((w) =>
      w.where('occurred_at', '<', occurred_at).orWhere((x) => x.where('occurred_at', occurred_at).andWhere('id', '<', id)),
    );
  }
  const rows = await query.limit(filters.limit + 1);
  return rows.map((row) => ({
    id: row.id,
    occurred_at: row.occurred_at,
    actor: { type: row.actor_type, id: row.actor_id, label: row.actor_label },
    action: row.action,
    target: { type: row.target_type, id: row.target_id },
    before: parseJsonColumn<unknown>(row.before_json),
    after: parseJsonColumn<unknown>(row.after_json),
    request_id: row.request_id,
  }));
}
