// Webhook endpoints: create (the secret shown once), list, get, change, delete, rotate the secret
// with an overlap during which deliveries carry both signatures. Every change is audited; the
// secret is never in an audit entry or a GET.
import type { AppContext } from '../../context.ts';
import { inTransaction, type Queryable } from '../../db/transaction.ts';
import { newId } from '../../lib/ids.ts';
import { mapPage } from '../../lib/pagination.ts';
import { NotFoundProblem } from '../../lib/problems.ts';
import { addMinutes, nowIso } from '../../lib/time.ts';
import type { z } from '../../lib/zod.ts';
import { actorOf } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import type { EventType } from '../events/events.repository.ts';
import { assertEndpointUrlAllowed } from './endpoint-url.ts';
import { newWebhookSecret } from './signature.ts';
import {
  deleteEndpointRow,
  findEndpoint,
  insertEndpoint,
  listEndpointRows,
  updateEndpointRow,
  type WebhookEndpointRow,
} from './webhooks.repository.ts';
import type {
  CreateWebhookEndpointRequestSchema,
  UpdateWebhookEndpointRequestSchema,
  WebhookEndpointListQuerySchema,
} from './webhooks.schemas.ts';

export function toEndpoint(row: WebhookEndpointRow) {
  return {
    id: row.id,
    url: row.url,
    description: row.description,
    event_types: JSON.parse(row.event_types_json) as EventType[],
    enabled: Boolean(row.enabled),
    disabled_reason: row.disabled_reason,
    previous_secret_expires_at: row.previous_secret_expires_at,
    failing_since: row.failing_since,
    created_by: row.created_by_label,
    created_at: row.created_at,
    updated_at: row.updated_at,
  };
}

export async function loadEndpoint(db: Queryable, id: string): Promise<WebhookEndpointRow> {
  const row = await findEndpoint(db, id);
  if (!row) throw new NotFoundProblem(`No webhook endpoint ${id}.`);
  return row;
}

export async function createEndpoint(
  ctx: AppContext,
  auth: AuthContext,
  input: z.output<typeof CreateWebhookEndpointRequestSchema>,
  requestId?: string,
) {
  await assertEndpointUrlAllowed(ctx.config, input.url);
  const now = nowIso();
  const secret = newWebhookSecret();
  const row: WebhookEndpointRow = {
    id: newId('whe'),
    url: input.url,
    description: input.description || null,
    event_types_json: JSON.stringify(input.event_types),
    enabled: input.enabled,
    disabled_reason: null,
    secret,
    previous_secret: null,
    previous_secret_expires_at: null,
    failing_since: null,
    owner_user_id: auth.userId,
    created_by_label: auth.label,
    created_at: now,
    updated_at: now,
  };
  await inTransaction(ctx.db, async (trx) => {
    await insertEndpoint(trx, row);
    const after = toEndpoint(row);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.created',
      targetType: 'webhook_endpoint',
      targetId: row.id,
      after,
    });
  });
  return { ...toEndpoint(row), secret };
}

export async function listEndpointsPage(ctx: AppContext, query: z.output<typeof WebhookEndpointListQuerySchema>) {
  return mapPage(await listEndpointRows(ctx.db, query), toEndpoint);
}

export async function getEndpoint(ctx: AppContext, id: string) {
  return toEndpoint(await loadEndpoint(ctx.db, id));
}

export async function updateEndpoint(
  ctx: AppContext,
  auth: AuthContext,
  id: string,
  input: z.output<typeof UpdateWebhookEndpointRequestSchema>,
  requestId?: string,
) {
  if (input.url !== undefined) await assertEndpointUrlAllowed(ctx.config, input.url);
  return inTransaction(ctx.db, async (trx) => {
    const before = await loadEndpoint(trx, id);
    const changes: Partial<WebhookEndpointRow> = { updated_at: nowIso() };
    if (input.url !== undefined) changes.url = input.url;
    if (input.event_types !== undefined) changes.event_types_json = JSON.stringify(input.event_types);
    if (input.description !== undefined) changes.description = input.description || null;
    if (input.enabled !== undefined) changes.enabled = input.enabled;
    if (input.enabled) Object.assign(changes, { disabled_reason: null, failing_since: null });
    await updateEndpointRow(trx, id, changes);
    const after = toEndpoint({ ...before, ...changes });
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.updated',
      targetType: 'webhook_endpoint',
      targetId: id,
      before: toEndpoint(before),
      after,
    });
    return after;
  });
}

/** Deletes the endpoint with its delivery log. */
export async function deleteEndpoint(ctx: AppContext, auth: AuthContext, id: string, requestId?: string): Promise<void> {
  await inTransaction(ctx.db, async (trx) => {
    const before = await loadEndpoint(trx, id);
    await deleteEndpointRow(trx, id);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.deleted',
      targetType: 'webhook_endpoint',
      targetId: id,
      before: toEndpoint(before),
    });
  });
}

/** A new secret, shown once; the old one keeps signing (as a second signature) for the overlap. */
export async function rotateEndpointSecret(ctx: AppContext, auth: AuthContext, id: string, overlapMinutes: number, requestId?: string) {
  return inTransaction(ctx.db, async (trx) => {
    const before = await loadEndpoint(trx, id);
    const now = nowIso();
    const secret = newWebhookSecret();
    const changes = {
      secret,
      previous_secret: overlapMinutes > 0 ? before.secret : null,
      previous_secret_expires_at: overlapMinutes > 0 ? addMinutes(now, overlapMinutes) : null,
      updated_at: now,
    };
    await updateEndpointRow(trx, id, changes);
    await recordAudit(trx, {
      actor: actorOf(auth),
      requestId,
      action: 'webhook_endpoint.secret_rotated',
      targetType: 'webhook_endpoint',
      targetId: id,
      after: { overlap_minutes: overlapMinutes, previous_secret_expires_at: changes.previous_secret_expires_at },
    });
    return { ...toEndpoint({ ...before, ...changes }), secret };
  });
}
