import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { EventTypeSchema } from '../events/events.schemas.ts';

const eventTypes = z
  .array(EventTypeSchema)
  .min(1)
  .refine((types) => new Set(types).size === types.length, 'list each event type once')
  .openapi({ description: 'The event types sent to this endpoint.', example: ['sample.created', 'sample.released'] });

const url = z
  .url({ protocol: /^https?$/ })
  .max(2000)
  .openapi({
    description:
      'Where deliveries are POSTed. https is required in production; addresses on loopback, private, link-local, CGNAT or metadata networks are refused (when saved and at every connection) unless WEBHOOK_ALLOW_PRIVATE=true.',
    example: 'https://mes.kestrelbend.test/hooks/meltwire',
  });

export const WebhookEndpointSchema = z
  .object({
    id: z.string(),
    url: z.string(),
    description: z.string().nullable(),
    event_types: z.array(EventTypeSchema),
    enabled: z.boolean(),
    disabled_reason: z
      .string()
      .nullable()
      .openapi({ description: 'Why Meltwire disabled it (the receiver answered 410 Gone, or every attempt failed for 5 days).' }),
    previous_secret_expires_at: z.string().nullable().openapi({
      format: 'date-time',
      description: 'Until then deliveries carry a second signature, made with the secret before the last rotation.',
    }),
    failing_since: z
      .string()
      .nullable()
      .openapi({ format: 'date-time', description: 'Since when every attempt has failed; null while deliveries succeed.' }),
    created_by: z.string(),
    created_at: z.string().openapi({ format: 'date-time' }),
    updated_at: z.string().openapi({ format: 'date-time' }),
  })
  .openapi('WebhookEndpoint');

export const WebhookEndpointWithSecretSchema = WebhookEndpointSchema.extend({
  secret: z.string().openapi({
    description: 'The signing secret, shown once: verify the `webhook-signature` of each delivery with it (Standard Webhooks).',
    example: 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw',
  }),
}).openapi('WebhookEndpointWithSecret');

export const WebhookEndpointListSchema = listOf(WebhookEndpointSchema, 'WebhookEndpointList');
export const WebhookEndpointListQuerySchema = paginationQuery;

export const CreateWebhookEndpointRequestSchema = z
  .object({
    url,
    event_types: eventTypes,
    description: z.string().trim().max(500).optional(),
    enabled: z.boolean().default(true),
  })
  .openapi('CreateWebhookEndpointRequest');

export const UpdateWebhookEndpointRequestSchema = z
  .object({
    url: url.optional(),
    event_types: eventTypes.optional(),
    description: z.string().trim().max(500).nullable().optional(),
    enabled: z.boolean().optional().openapi({ description: 'Enabling an endpoint Meltwire disabled clears its reason.' }),
  })
  .refine((body) => Object.values(body).some((value) => value !== undefined), 'change at least one field')
  .openapi('UpdateWebhookEndpointRequest');

export const RotateWebhookSecretRequestSchema = z
  .object({
    overlap_minutes: z
      .number()
      .int()
      .min(0)
      .max(7 * 24 * 60)
      .default(24 * 60)
      .openapi({ description: 'How long deliveries are also signed with the old secret (0–10080 minutes, default 24 h).' }),
  })
  .openapi('RotateWebhookSecretRequest');

export const WebhookEndpointIdParams = z.object({ id: z.string().min(1).max(40) });
