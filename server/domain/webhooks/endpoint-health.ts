// What an attempt means for its endpoint: a success clears its failing streak; a 410 Gone disables
// it; failures since more than five days disable it too, and its owner is told by e-mail.
import type { AppContext } from '../../context.ts';
import type { Transaction } from '../../db/transaction.ts';
import { SYSTEM_ACTOR } from '../audit/actor.ts';
import { recordAudit } from '../audit/audit.repository.ts';
import { findUserById } from '../users/users.repository.ts';
import type { Outcome } from './retry-policy.ts';
import { queueAlert } from '../alerts/alerts.service.ts';
import { findEndpoint, updateEndpointRow, type WebhookEndpointRow } from './webhooks.repository.ts';

export const FAILING_DAYS_BEFORE_DISABLE = 5;

const GONE = 'The receiver answered 410 Gone: it asked not to be sent more.';
const FAILING = `Every delivery attempt has failed for ${FAILING_DAYS_BEFORE_DISABLE} days.`;

async function disable(ctx: AppContext, trx: Transaction, endpoint: WebhookEndpointRow, reason: string, now: string) {
  await updateEndpointRow(trx, endpoint.id, { enabled: false, disabled_reason: reason, updated_at: now });
  await recordAudit(trx, {
    actor: SYSTEM_ACTOR,
    action: 'webhook_endpoint.disabled',
    targetType: 'webhook_endpoint',
    targetId: endpoint.id,
    after: { enabled: false, disabled_reason: reason },
  });
  await queueAlert(trx, {
    kind: 'webhook_disabled',
    instrumentId: null,
    subject: `Webhook endpoint ${endpoint.url} disabled`,
    lines: [reason, `Endpoint ${endpoint.id} receives no more deliveries until it is enabled again.`],
    path: '/webhooks',
  });
  const owner = endpoint.owner_user_id ? await findUserById(trx, endpoint.owner_user_id) : undefined;
  if (!owner) return;
  const message = {
    to: owner.email,
    subject: `Meltwire disabled the webhook endpoint ${endpoint.url}`,
    text: `${reason}\n\nEndpoint ${endpoint.id} (${endpoint.url}) receives no more deliveries until it is enabled again (PATCH /api/v1/webhook-endpoints/${endpoint.id} with {"enabled": true}). Events meanwhile stay in the pull feed (GET /api/v1/events); failed deliveries can be sent again with POST /api/v1/webhook-endpoints/${endpoint.id}/recover.`,
  };
  // After the commit, so that no e-mail tells of a change that was rolled back.
  trx.executionPromise?.then(
    () => ctx.mailer.send(message),
    () => undefined,
  );
}

export async function endpointAfterAttempt(ctx: AppContext, trx: Transaction, loaded: WebhookEndpointRow, outcome: Outcome, now: string) {
  if (outcome === 'delivered') {
    // As loaded with the claim: a streak that began since then ends at the next success.
    if (loaded.failing_since) await updateEndpointRow(trx, loaded.id, { failing_since: null });
    return;
  }
  const endpoint = (await findEndpoint(trx, loaded.id)) ?? loaded;
  if (!endpoint.enabled) return;
  if (outcome === 'gone') return disable(ctx, trx, endpoint, GONE, now);
  if (!endpoint.failing_since) return updateEndpointRow(trx, endpoint.id, { failing_since: now });
  const days = (Date.parse(now) - Date.parse(endpoint.failing_since)) / 86_400_000;
  if (days >= FAILING_DAYS_BEFORE_DISABLE) await disable(ctx, trx, endpoint, FAILING, now);
}
