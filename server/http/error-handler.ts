// The one error handler, last in the app: every failure leaves as application/problem+json.
import { STATUS_CODES } from 'node:http';
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import {
  InternalProblem,
  MalformedBodyProblem,
  MalformedJsonProblem,
  MalformedUrlProblem,
  NotFoundProblem,
  PayloadTooLargeProblem,
  PROBLEM_CONTENT_TYPE,
  ProblemError,
} from '../lib/problems.ts';
import { isUnstorableValue } from '../db/errors.ts';
import { statusSlug } from '../lib/problem-types.ts';

interface HttpishError {
  type?: string;
  status?: unknown;
  statusCode?: unknown;
  code?: unknown;
  expose?: boolean;
  message?: string;
}

/** A 4xx carried by an error of body-parser, the router, multer or express.static. */
function clientStatus(e: HttpishError): number | undefined {
  const status = typeof e.status === 'number' ? e.status : typeof e.statusCode === 'number' ? e.statusCode : undefined;
  return status !== undefined && status >= 400 && status < 500 ? status : undefined;
}

function toProblem(error: unknown, bodyLimit: string): ProblemError | undefined {
  if (error instanceof ProblemError) return error;
  const e = (error ?? {}) as HttpishError;
  if (e.type === 'entity.parse.failed') return new MalformedJsonProblem();
  if (isUnstorableValue(error)) {
    return new ProblemError(
      400,
      'unstorable-value',
      'A value cannot be stored',
      'The request holds a value the database cannot store: a NUL character, text longer than the field allows, or a number out of range.',
    );
  }
  // Upload size limits are turned into problems where uploads are parsed (http/upload.ts).
  if (e.type === 'entity.too.large') return new PayloadTooLargeProblem(bodyLimit);
  if (e.type === 'encoding.unsupported') {
    return new ProblemError(
      415,
      'unsupported-media-type',
      'Unsupported Content-Encoding',
      'Send the body uncompressed, or compressed with gzip, deflate or br and the matching Content-Encoding.',
    );
  }
  if (e.type === 'charset.unsupported') {
    return new ProblemError(415, 'unsupported-media-type', 'Unsupported body encoding', 'Send the body as UTF-8.');
  }
  const status = clientStatus(e);
  if (status === undefined) return undefined;
  // zlib's errors (Z_DATA_ERROR …, brotli's ERR__ERROR_…), passed on by body-parser with status
  // 400: the body is not what its Content-Encoding says.
  if (typeof e.code === 'string' && /^(Z_|ERR__ERROR_)/.test(e.code)) {
    return new MalformedBodyProblem(
      'Body does not match its Content-Encoding',
      'The body cannot be decompressed as its Content-Encoding says; send it uncompressed without Content-Encoding, or compressed as declared.',
    );
  }
  // The router's "Failed to decode param" (and the same from the request validator in tests).
  if (error instanceof URIError || /malformed uri|decode param/i.test(e.message ?? '')) {
    return new MalformedUrlProblem('The path is not valid percent-encoding (such as "%ZZ"); write a literal "%" as "%25".');
  }
  return new ProblemError(status, statusSlug(status), STATUS_CODES[status] ?? 'Bad request', e.expose === false ? undefined : e.message);
}

export function sendProblem(res: Parameters<RequestHandler>[1], problem: ProblemError, instance: string, requestId?: string): void {
  if (problem.status === 429 && !res.getHeader('Retry-After')) res.setHeader('Retry-After', '60');
  // res.json (with the problem type kept) so that response validation in tests sees problems too.
  res
    .status(problem.status)
    .type(PROBLEM_CONTENT_TYPE)
    .json({ ...problem.toBody(instance), ...(requestId ? { request_id: requestId } : {}) });
}

export function notFoundHandler(): RequestHandler {
  return (req, _res, next) => next(new NotFoundProblem(`No route for ${req.method} ${req.originalUrl.split('?')[0]}.`));
}

export function errorHandler(logger: Logger, bodyLimit: string): ErrorRequestHandler {
  return (error, req, res, _next) => {
    let problem = toProblem(error, bodyLimit);
    if (!problem) {
      logger.error({ err: error, requestId: req.requestId }, 'unhandled error');
      problem = new InternalProblem();
    }
    if (res.headersSent) {
      res.end();
      return;
    }
    sendProblem(res, problem, req.originalUrl.split('?')[0], req.requestId);
  };
}
