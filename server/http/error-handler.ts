// The one error handler, last in the app: every failure leaves as application/problem+json.
import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import {
  InternalProblem,
  MalformedJsonProblem,
  NotFoundProblem,
  PayloadTooLargeProblem,
  PROBLEM_CONTENT_TYPE,
  ProblemError,
} from '../lib/problems.ts';

interface HttpishError {
  type?: string;
  status?: number;
  code?: string;
}

function toProblem(error: unknown, bodyLimit: string): ProblemError | undefined {
  if (error instanceof ProblemError) return error;
  const e = (error ?? {}) as HttpishError;
  if (e.type === 'entity.parse.failed') return new MalformedJsonProblem();
  // Upload size limits are turned into problems where uploads are parsed (http/upload.ts).
  if (e.type === 'entity.too.large') return new PayloadTooLargeProblem(bodyLimit);
  if (e.type === 'encoding.unsupported' || e.type === 'charset.unsupported') {
    return new ProblemError(415, 'unsupported-media-type', 'Unsupported body encoding', 'Send the body as UTF-8.');
  }
  return undefined;
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
