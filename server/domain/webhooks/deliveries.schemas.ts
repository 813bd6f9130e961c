import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';

const DeliveryStatusSchema = z.enum(['pending', 'delivered', 'failed']).openapi('WebhookDeliveryStatus', {
  description: 'pending: waiting for its next attempt (or an attempt is under way); delivered: a 2xx answer; failed: no more attempts.',
});

const time = z.string().openapi({ format: 'date-time' });

export const WebhookDeliverySchema = z
  .object({
    id: z.string(),
    endpoint_id: z.string(),
    event_id: z.string().openapi({ description: 'Also the `webhook-id` header of every attempt.' }),
    event_type: z.string().openapi({ description: 'An event type, or `meltwire.test` for a test event.' }),
    status: DeliveryStatusSchema,
    attempts: z.number().int().openapi({ description: 'Attempts made so far.' }),
    next_attempt_at: time.nullable().openapi({ description: 'When the next attempt is due; null when none will be made.' }),
    last_status_code: z.number().int().nullable(),
    last_error: z.string().nullable(),
    created_at: time,
    updated_at: time,
    delivered_at: time.nullable(),
  })
  .openapi('WebhookDelivery');

export const WebhookAttemptSchema = z
  .object({
    number: z.number().int(),
    started_at: time,
    duration_ms: z.number(),
    status_code: z.number().int().nullable().openapi({ description: 'The HTTP status answered; null after a network error or time-out.' }),
    response_excerpt: z.string().nullable().openapi({ description: 'The first 2 KB of the answer.' }),
    error: z.string().nullable(),
    outcome: z
      .enum(['delivered', 'retry', 'failed', 'gone'])
      .openapi({ description: '`gone`: the receiver answered 410 and the endpoint was disabled.' }),
    next_attempt_at: time.nullable(),
  })
  .openapi('WebhookAttempt');

export const WebhookDeliveryDetailSchema = WebhookDeliverySchema.extend({ attempt_log: z.array(WebhookAttemptSchema) }).openapi(
  'WebhookDeliveryDetail',
);

export const WebhookDeliveryListSchema = listOf(WebhookDeliverySchema, 'WebhookDeliveryList');

export const WebhookDeliveryListQuerySchema = paginationQuery.extend({ status: DeliveryStatusSchema.optional() });

export const RecoverDeliveriesRequestSchema = z
  .object({
    since: z.iso
      .datetime({ offset: true })
      .transform((value) => new Date(value).toISOString())
      .refine((value) => value <= new Date().toISOString(), 'must not be in the future')
      .openapi({
        description: 'Re-queue every delivery to this endpoint created since then that failed.',
        example: '2026-12-01T06:00:00Z',
      }),
  })
  .openapi('RecoverDeliveriesRequest');

export const RecoverDeliveriesSchema = z
  .object({ requeued: z.number().int().openapi({ description: 'How many failed deliveries were put back in the queue.' }) })
  .openapi('RecoveredDeliveries');

export const WebhookDeliveryIdParams = z.object({ id: z.string().min(1).max(40) });
