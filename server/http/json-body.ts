// JSON bodies: parsed within BODY_LIMIT and checked right away, before anything else reads them
// (authentication, idempotency fingerprints, routes). A body nested more than MAX_JSON_DEPTH
// levels is refused with 400, and so is a key "__proto__" anywhere (server/lib/reserved-keys.ts):
// naming it is clearer than dropping it. The request log, mounted before, still records the call.
// GET and HEAD bodies are not read: they carry no meaning for any operation.
import express, { type RequestHandler } from 'express';
import { checkJsonShape } from '../lib/json-shape.ts';
import { JsonTooDeepProblem, ValidationProblem } from '../lib/problems.ts';

/** Levels of nested objects and arrays a JSON body may have; no request schema needs more than 8. */
export const MAX_JSON_DEPTH = 64;

const BODILESS = new Set(['GET', 'HEAD']);

export function jsonBody(bodyLimit: string): RequestHandler[] {
  const parse = express.json({ limit: bodyLimit });
  const parseJson: RequestHandler = (req, res, next) => (BODILESS.has(req.method) ? next() : parse(req, res, next));
  const checkShape: RequestHandler = (req, _res, next) => {
    const issue = req.body === undefined ? undefined : checkJsonShape(req.body, MAX_JSON_DEPTH);
    if (!issue) return next();
    if (issue.kind === 'too_deep') return next(new JsonTooDeepProblem(MAX_JSON_DEPTH));
    const location = ['body', ...issue.path].join('.');
    next(new ValidationProblem([{ location, message: '"__proto__" is not accepted as a name', code: 'reserved_name' }]));
  };
  return [parseJson, checkShape];
}
