// Records every /api/v1 call in the request log (see the README for what is kept and redacted).
// Mounted first on the API router, so calls refused by authentication, rate limits or body
// parsing are recorded too. Health checks and the OpenAPI document are not recorded: monitors
// poll them often and they carry no caller data.
import type { Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../context.ts';
import { type BodySnapshot, snapshotRequestBody, snapshotResponseBody } from './body-snapshot.ts';
import { recorderFor } from '../domain/request-log/recorder.ts';
import { redactHeaders, redactQuery, redactText } from '../domain/request-log/redact.ts';
import type { RequestLogRow } from '../domain/request-log/request-log.repository.ts';
import { newId } from '../lib/ids.ts';
import { nowIso } from '../lib/time.ts';
import { captureResponse } from './response-capture.ts';

/** Paths below /api/v1 that are not recorded. */
const NOT_LOGGED = new Set(['/health', '/openapi.json']);
/** Carries a replay's one-time token from the replay endpoint to the replayed request. */
export const REPLAY_TOKEN_HEADER = 'x-meltwire-replay';
/** Sent by the console's API client: its session calls are its own page loads and polling. */
export const CONSOLE_CLIENT_HEADER = 'x-meltwire-client';
/** Responses are captured up to this size so JSON can be parsed and redacted before it is cut. */
const MIN_CAPTURE_BYTES = 1024 * 1024;

function caller(req: Request): Pick<RequestLogRow, 'caller_type' | 'caller_id' | 'caller_label' | 'owner_user_id'> {
  const auth = req.auth;
  if (!auth) return { caller_type: 'anonymous', caller_id: null, caller_label: null, owner_user_id: null };
  if (auth.kind === 'api_key')
    return { caller_type: 'api_key', caller_id: auth.apiKeyId ?? null, caller_label: auth.label, owner_user_id: auth.userId };
  return { caller_type: 'user', caller_id: auth.userId, caller_label: auth.email, owner_user_id: auth.userId };
}

function buildRow(
  req: Request,
  res: Response,
  base: Pick<RequestLogRow, 'id' | 'occurred_at' | 'replay_of'>,
  durationMs: number,
  response: BodySnapshot,
  limit: number,
): RequestLogRow {
  const [rawPath, rawQuery = ''] = req.originalUrl.split(/\?(.*)/s, 2);
  const path = redactText(rawPath);
  const query = redactQuery(rawQuery);
  const request = snapshotRequestBody(req, limit);
  return {
    ...base,
    method: req.method,
    path: path.value.slice(0, 2000),
    query: query.value,
    status: res.statusCode,
    duration_ms: Math.round(durationMs * 1000) / 1000,
    ...caller(req),
    // Only a signed-in session counts: an API key call is an integration's, whatever it sends.
    from_console: req.auth?.kind === 'session' && req.get(CONSOLE_CLIENT_HEADER) === 'console' && base.replay_of === null,
    request_id: req.requestId,
    request_headers_json: JSON.stringify(redactHeaders(req.headers)),
    request_content_type: request.contentType?.slice(0, 200) ?? null,
    request_body_kind: request.kind,
    request_body: request.body,
    request_body_size: request.size,
    request_body_truncated: request.truncated,
    request_redacted: request.redacted || query.redacted || path.redacted,
    response_headers_json: JSON.stringify(redactHeaders(res.getHeaders() as Record<string, string | string[] | number>)),
    response_content_type: response.contentType?.slice(0, 200) ?? null,
    response_body_kind: response.kind,
    response_body: response.body,
    response_body_size: response.size,
    response_body_truncated: response.truncated,
  };
}

export function requestLog(ctx: AppContext): RequestHandler {
  const recorder = recorderFor(ctx);
  const limit = ctx.config.requestLogBodyLimit;
  return (req, res, next) => {
    if (NOT_LOGGED.has(req.path)) return next();
    const ticket = recorder.claimReplay(req.get(REPLAY_TOKEN_HEADER));
    delete req.headers[REPLAY_TOKEN_HEADER];
    const base = { id: ticket?.entryId ?? newId('req'), occurred_at: nowIso(), replay_of: ticket?.replayOf ?? null };
    const started = performance.now();
    captureResponse(res, Math.max(limit, MIN_CAPTURE_BYTES), (captured) => {
      try {
        const contentType = res.getHeader('content-type');
        const body = snapshotResponseBody(contentType === undefined ? null : String(contentType), captured, limit);
        recorder.record(buildRow(req, res, base, performance.now() - started, body, limit));
      } catch (error) {
        ctx.logger.error({ err: error, requestId: req.requestId }, 'request log entry could not be built');
      }
    });
    next();
  };
}
