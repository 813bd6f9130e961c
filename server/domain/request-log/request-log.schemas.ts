import { listOf, paginationQuery } from '../../lib/pagination.ts';
import { z } from '../../lib/zod.ts';
import { BODY_KINDS } from './body-kinds.ts';

const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'] as const;

const CallerSchema = z
  .object({
    type: z.enum(['user', 'api_key', 'anonymous']),
    id: z.string().nullable().openapi({ description: 'The user id or the API key id; null for anonymous calls.' }),
    label: z.string().nullable().openapi({ example: 'MES melt shop (mw_live_7Qm2xP…)' }),
  })
  .openapi('RequestLogCaller');

const RequestLogSummarySchema = z
  .object({
    id: z.string(),
    occurred_at: z.string().openapi({ format: 'date-time' }),
    method: z.string().openapi({ example: 'GET' }),
    path: z.string().openapi({ example: '/api/v1/samples' }),
    query: z.string().openapi({ description: 'The query string without `?`, secrets redacted.', example: 'limit=50' }),
    status: z.number().int(),
    duration_ms: z.number(),
    caller: CallerSchema,
    request_id: z.string(),
    replay_of: z.string().nullable().openapi({ description: 'The entry this call replayed.' }),
    from_console: z.boolean().openapi({
      description:
        "A call the console made for its own pages (signed in, sent by the console's client); left out of lists unless `include_console=true`.",
    }),
  })
  .openapi('RequestLogSummary');

const BodySchema = (name: string) =>
  z
    .object({
      headers: z.record(z.string(), z.string()).openapi({ description: 'Authorization, Cookie and Set-Cookie values are redacted.' }),
      content_type: z.string().nullable(),
      body_kind: z.enum(BODY_KINDS).openapi({
        description: '`multipart` bodies are described (field, file name, size, type), not stored; `binary` bodies are not stored.',
      }),
      body: z.string().nullable().openapi({ description: 'The body as text with secrets redacted, cut at the configured limit.' }),
      body_size: z.number().int().openapi({ description: 'Bytes of the original body.' }),
      body_truncated: z.boolean(),
    })
    .openapi(name);

export const RequestLogEntrySchema = RequestLogSummarySchema.extend({
  request: BodySchema('RequestLogRequest'),
  response: BodySchema('RequestLogResponse'),
  replayable: z.boolean(),
  not_replayable_reason: z.string().nullable().openapi({ description: 'Why `replayable` is false.' }),
}).openapi('RequestLogEntry');

export const RequestLogListSchema = listOf(RequestLogSummarySchema, 'RequestLogList');

export const RequestLogQuerySchema = paginationQuery.extend({
  method: z.enum(HTTP_METHODS).optional().openapi({ description: 'Only calls with this HTTP method.', example: 'POST' }),
  status: z
    .string()
    .regex(/^[1-5](\d\d|xx)$/i, 'a status code like 404, or a class like 4xx')
    .optional()
    .openapi({ description: 'A status code (`404`) or a class (`4xx`).', example: '4xx' }),
  path_prefix: z.string().min(1).max(500).optional().openapi({ description: 'Paths starting with this text, e.g. `/api/v1/samples`.' }),
  caller_id: z.string().min(1).max(40).optional().openapi({ description: 'Calls by this user id or API key id.' }),
  since: z.iso.datetime().optional().openapi({ description: 'Calls at or after this time (ISO 8601 UTC).' }),
  until: z.iso.datetime().optional().openapi({ description: 'Calls before this time (ISO 8601 UTC).' }),
  include_console: z
    .enum(['true', 'false'])
    .default('false')
    .transform((value) => value === 'true')
    .openapi({
      description:
        "Also list the console's own calls (its pages loading and polling). Calls made with API keys, replays and the API reference's Try it out are always listed.",
    }),
});

export const RequestLogIdParams = z.object({ id: z.string().min(1).max(40) });
