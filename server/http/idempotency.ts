// Idempotency-Key on writes: the first response to (caller, key) is kept for 24 hours and
// replayed to retries with `Idempotent-Replayed: true`. The same key with another request is a
// 422; a retry while the first is still running is a 409. Anonymous calls and 5xx answers are
// not kept. Runs after a route's `before` middleware so uploaded files count in the fingerprint.
import type { Request, RequestHandler, Response } from 'express';
import type { AppContext } from '../context.ts';
import { fingerprintRequest } from './request-fingerprint.ts';
import {
  claimIdempotencyKey,
  completeIdempotencyKey,
  type IdempotencyRow,
  releaseIdempotencyKey,
  renewIdempotencyClaim,
} from '../domain/idempotency/idempotency.repository.ts';
import { ConflictProblem, UnprocessableProblem, ValidationProblem } from '../lib/problems.ts';
import { captureResponse } from './response-capture.ts';
import type { AuthContext } from '../domain/auth/auth-context.ts';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
export const REPLAYED_HEADER = 'Idempotent-Replayed';
export const IDEMPOTENCY_TTL_MS = 24 * 60 * 60_000;
export const IDEMPOTENCY_KEY_MAX = 255;
/** An in-flight claim not renewed for this long belongs to a request that died with its process. */
export const STALE_CLAIM_MS = 30_000;
/** A request still running renews its claim this often, so only a dead one's claim goes stale. */
const CLAIM_RENEWAL_MS = 10_000;
/** Responses larger than this are not kept (writes answer with small documents). */
const MAX_STORED_BYTES = 5 * 1024 * 1024;
/** Response headers a replay repeats. */
const KEPT_HEADERS = ['content-type', 'location'];

export interface IdempotencyOptions {
  /** The success response carries a secret Meltwire must not keep (a new API key). */
  secretInResponse?: boolean;
}

function callerOf(auth: AuthContext | undefined): string | undefined {
  if (auth?.apiKeyId) return `key:${auth.apiKeyId}`;
  if (auth) return `user:${auth.userId}`;
  return undefined;
}

function readKey(req: Request): string | undefined {
  const key = req.get(IDEMPOTENCY_HEADER);
  if (key === undefined) return undefined;
  if (key.length < 1 || key.length > IDEMPOTENCY_KEY_MAX) {
    throw new ValidationProblem([
      {
        location: `header.${IDEMPOTENCY_HEADER}`,
        message: `must be 1 to ${IDEMPOTENCY_KEY_MAX} characters (got ${key.length})`,
        code: 'too_big',
      },
    ]);
  }
  return key;
}

function replayStored(res: Response, row: IdempotencyRow): void {
  const headers = JSON.parse(row.response_headers_json ?? '{}') as Record<string, string>;
  if (row.body_withheld) {
    throw new ConflictProblem(
      `This ${IDEMPOTENCY_HEADER} already succeeded. Its response carried a secret that Meltwire shows once and does not keep, so it cannot be replayed${headers.location ? `; the resource is ${headers.location}` : ''}.`,
      { idempotency_key_status: row.status, ...(headers.location ? { resource: headers.location } : {}) },
    );
  }
  for (const [name, value] of Object.entries(headers)) res.setHeader(name, value);
  res.setHeader(REPLAYED_HEADER, 'true');
  res.status(row.status ?? 200).end(Buffer.from(row.response_body_base64 ?? '', 'base64'));
}

function answerExisting(req: Request, res: Response, row: IdempotencyRow, fingerprint: string): void {
  if (row.fingerprint !== fingerprint) {
    const sameTarget = row.method === req.method && row.path === req.originalUrl;
    throw new UnprocessableProblem(
      sameTarget
        ? `This ${IDEMPOTENCY_HEADER} was already used with a different request body. Use a new key for a new request.`
        : `This ${IDEMPOTENCY_HEADER} was already used for ${row.method} ${row.path}. Use a new key for a new request.`,
    );
  }
  if (row.state === 'in_flight') {
    throw new ConflictProblem(`A request with this ${IDEMPOTENCY_HEADER} is still being processed; retry once it has finished.`);
  }
  replayStored(res, row);
}

export function idempotency(ctx: AppContext, options: IdempotencyOptions = {}): RequestHandler {
  return async (req, res, next) => {
    const key = readKey(req);
    const caller = callerOf(req.auth);
    if (key === undefined || !caller) return next();

    const fingerprint = await fingerprintRequest(req);
    const claim = await claimIdempotencyKey(ctx.db, {
      caller,
      key,
      fingerprint,
      method: req.method,
      path: req.originalUrl,
      now: new Date(),
      ttlMs: IDEMPOTENCY_TTL_MS,
      staleMs: STALE_CLAIM_MS,
    });
    if (claim.kind === 'existing') return answerExisting(req, res, claim.row, fingerprint);

    let settled = false;
    const renewal = setInterval(() => {
      renewIdempotencyClaim(ctx.db, caller, key, new Date()).catch((error: unknown) =>
        ctx.logger.error({ err: error }, 'idempotency claim renewal failed'),
      );
    }, CLAIM_RENEWAL_MS);
    renewal.unref();
    res.on('finish', () => clearInterval(renewal));
    const release = async () => {
      clearInterval(renewal);
      if (settled) return;
      settled = true;
      await releaseIdempotencyKey(ctx.db, caller, key);
    };
    captureResponse(res, MAX_STORED_BYTES, async ({ body, complete }) => {
      try {
        if (res.statusCode >= 500 || !complete) return await release();
        settled = true;
        const headers = Object.fromEntries(
          KEPT_HEADERS.flatMap((name) => (res.getHeader(name) === undefined ? [] : [[name, String(res.getHeader(name))]])),
        );
        const withhold = options.secretInResponse && res.statusCode < 300;
        await completeIdempotencyKey(ctx.db, caller, key, { status: res.statusCode, headers, body: withhold ? null : body });
      } catch (error) {
        ctx.logger.error({ err: error, requestId: req.requestId }, 'idempotency record failed');
      }
    });
    // A client that hangs up before the answer leaves the key free for its retry.
    res.on('close', () => {
      clearInterval(renewal);
      if (!res.writableFinished) release().catch((error: unknown) => ctx.logger.error({ err: error }, 'idempotency release failed'));
    });
    next();
  };
}
