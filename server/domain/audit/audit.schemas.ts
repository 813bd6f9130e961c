import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';

const AuditEventSchema = z
  .object({
    id: z.string(),
    occurred_at: z.string().openapi({ format: 'date-time' }),
    actor: z.object({
      type: z.enum(['user', 'api_key', 'system']),
      id: z.string().nullable(),
      label: z.string(),
    }),
    action: z.string().openapi({ example: 'user.role_changed' }),
    target: z.object({ type: z.string(), id: z.string().nullable() }),
    before: z.unknown().nullable().openapi({ description: 'The record before the change, where it applies.' }),
    after: z.unknown().nullable().openapi({ description: 'The record after the change, where it applies.' }),
    request_id: z.string().nullable(),
  })
  .openapi('AuditEvent');

export const AuditEventListSchema = listOf(AuditEventSchema, 'AuditEventList');

export const AuditQuerySchema = paginationQuery.extend({
  actor_id: z.string().optional(),
  action: z.string().optional(),
  target_type: z.string().optional(),
  target_id: z.string().optional(),
  since: z.iso.datetime().optional().openapi({ description: 'Events at or after this time (ISO 8601 UTC).' }),
  until: z.iso.datetime().optional().openapi({ description: 'Events before this time (ISO 8601 UTC).' }),
});
