import { replayEntry } from '../../http/replay.ts';
import {
  RequestLogEntrySchema,
  RequestLogIdParams,
  RequestLogListSchema,
  RequestLogQuerySchema,
} from '../../domain/request-log/request-log.schemas.ts';
import { getVisibleEntry, listEntries, toEntry } from '../../domain/request-log/request-log.service.ts';
import { defineRoute } from '../../http/route.ts';

const WHO_SEES =
  'Admins see every entry; everyone else sees their own calls and the calls made with keys they created; an API key restricted to instruments sees only its own calls. ' +
  'Bodies are cut at `REQUEST_LOG_BODY_LIMIT` bytes; Authorization, Cookie and Set-Cookie headers, fields named like password, secret or token, and anything shaped like an API key are redacted. ' +
  'Health checks and the OpenAPI document are not logged.';

export const requestLogRoutes = [
  defineRoute({
    method: 'get',
    path: '/request-log',
    operationId: 'listRequestLog',
    summary: 'Calls to the API, newest first',
    description: WHO_SEES,
    tag: 'Request log',
    access: { scope: 'request-log:read' },
    query: RequestLogQuerySchema,
    responses: { 200: { description: 'A page of calls.', schema: RequestLogListSchema } },
    async handler({ query, auth, ctx, reply }) {
      reply(200, await listEntries(ctx, auth, query));
    },
  }),
  defineRoute({
    method: 'get',
    path: '/request-log/{id}',
    operationId: 'getRequestLogEntry',
    summary: 'One call with its request and response',
    description: WHO_SEES,
    tag: 'Request log',
    access: { scope: 'request-log:read' },
    params: RequestLogIdParams,
    responses: { 200: { description: 'The call.', schema: RequestLogEntrySchema }, 404: { description: 'No such entry, or not yours.' } },
    async handler({ params, auth, ctx, reply }) {
      reply(200, toEntry(await getVisibleEntry(ctx, auth, params.id), ctx.config.requestLogBodyLimit));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/request-log/{id}/replay',
    operationId: 'replayRequestLogEntry',
    summary: 'Send a logged call again, as you',
    description:
      'Sends the same method, path, query, body, Content-Type, Accept and Idempotency-Key again with **your** credentials (the Authorization header or session cookie of this request). ' +
      'The replayed call is checked like any other: a scope you lack gives it its own 403. The new entry records `replay_of`. ' +
      'Multipart uploads, bodies cut by the size limit, requests with redacted secrets and sign-in calls are not replayable (422).',
    tag: 'Request log',
    access: { scope: 'request-log:read' },
    params: RequestLogIdParams,
    responses: {
      201: {
        description: "Replayed; the body is the new entry, with the replayed call's status and response.",
        schema: RequestLogEntrySchema,
        headers: { Location: 'The new entry.' },
      },
      404: { description: 'No such entry, or not yours.' },
      422: { description: 'This entry cannot be replayed; `detail` says why.' },
    },
    async handler({ params, auth, req, ctx, reply }) {
      const original = await getVisibleEntry(ctx, auth, params.id);
      const replayId = await replayEntry(ctx, req, original);
      const entry = await getVisibleEntry(ctx, auth, replayId);
      reply(201, toEntry(entry, ctx.config.requestLogBodyLimit), { Location: `/api/v1/request-log/${replayId}` });
    },
  }),
];
