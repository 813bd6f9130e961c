import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { ScopeSchema } from '../users/users.schemas.ts';

export const ApiKeySchema = z
  .object({
    id: z.string(),
    name: z.string(),
    prefix: z.string().openapi({ description: 'The first characters of the secret, for telling keys apart.', example: 'mw_live_7Qm2xP' }),
    scopes: z.array(ScopeSchema),
    instrument_ids: z.array(z.string()).nullable().openapi({ description: 'Instruments this key may touch; null = all.' }),
    created_by: z.object({ id: z.string(), email: z.string().nullable() }),
    created_at: z.string().openapi({ format: 'date-time' }),
    expires_at: z.string().nullable().openapi({ format: 'date-time' }),
    revoked_at: z.string().nullable().openapi({ format: 'date-time' }),
    last_used_at: z.string().nullable().openapi({ format: 'date-time' }),
    replaced_by: z.string().nullable().openapi({ description: 'The key that replaced this one when it was rolled.' }),
    status: z.enum(['active', 'expired', 'revoked']),
  })
  .openapi('ApiKey');

export const ApiKeyWithSecretSchema = ApiKeySchema.extend({
  secret: z.string().openapi({ description: 'Shown once. Store it now: Meltwire keeps only its hash.', example: 'mw_live_…' }),
}).openapi('ApiKeyWithSecret');

export const RolledApiKeySchema = ApiKeyWithSecretSchema.extend({
  previous: z
    .object({
      id: z.string(),
      expires_at: z.string().openapi({
        format: 'date-time',
        description: 'When the old key stops working: now + overlap_minutes, or its own expiry when that comes first.',
      }),
    })
    .openapi({ description: 'The key this one replaces.' }),
}).openapi('RolledApiKey');

export const ApiKeyListSchema = listOf(ApiKeySchema, 'ApiKeyList');

export const ApiKeyListQuerySchema = paginationQuery.extend({
  include_revoked: z
    .enum(['true', 'false'])
    .default('false')
    .transform((value) => value === 'true')
    .openapi({ description: 'Also list revoked keys.' }),
});

export const CreateApiKeyRequestSchema = z
  .object({
    name: z.string().trim().min(1).max(200).openapi({ example: 'MES melt shop' }),
    scopes: z
      .array(ScopeSchema)
      .min(1)
      .refine((s) => new Set(s).size === s.length, 'list each scope once'),
    expires_at: z.iso
      .datetime({ offset: true })
      .optional()
      .refine((value) => value === undefined || Date.parse(value) > Date.now(), 'must be in the future')
      .openapi({ description: 'When the key stops working; omit for no expiry.' }),
    instrument_ids: z.array(z.string().min(1)).min(1).optional().openapi({ description: 'Restrict the key to these instruments.' }),
  })
  .openapi('CreateApiKeyRequest');

export const RollApiKeyRequestSchema = z
  .object({
    overlap_minutes: z
      .number()
      .int()
      .min(0)
      .max(7 * 24 * 60)
      .default(60)
      .openapi({
        description:
          'How long the old key keeps working after the roll, so integrations can switch to the new one: 0 (stops at once) to 10080 minutes (7 days); 60 when omitted.',
      }),
  })
  .openapi('RollApiKeyRequest');

export const ApiKeyIdParams = z.object({ id: z.string().min(1).max(40) });
