// Tests only: checks every JSON response (problems included) against the OpenAPI document with
// express-openapi-validator. A mismatch is answered instead with a 500 problem naming it, so the
// test that produced the response fails. The package is a devDependency, loaded only when asked.
import { createRequire } from 'node:module';
import type { RequestHandler } from 'express';
import type * as OpenApiValidator from 'express-openapi-validator';
import { buildOpenApiDocument } from '../openapi/document.ts';
import type { AnyRoute } from './route.ts';
import { sendProblem } from './error-handler.ts';
import { ProblemError } from '../lib/problems.ts';

class ResponseMismatchProblem extends ProblemError {
  constructor(detail: string) {
    super(500, 'response-mismatch', 'The response does not match the OpenAPI document', detail);
  }
}

export function responseValidation(routes: AnyRoute[]): RequestHandler[] {
  const require = createRequire(import.meta.url);
  const validator = require('express-openapi-validator') as typeof OpenApiValidator;
  // The validator resolves references in place, so it gets its own copy of the document.
  const apiSpec = structuredClone(buildOpenApiDocument(routes)) as Parameters<typeof validator.middleware>[0]['apiSpec'];
  return validator.middleware({
    apiSpec,
    validateApiSpec: false,
    validateRequests: false,
    validateSecurity: false,
    // Routes parse their own uploads; the validator must not consume multipart bodies.
    fileUploader: false,
    ignoreUndocumented: true,
    validateResponses: {
      // Called while the response is being sent (res.json is already the original again), also
      // for problems sent by the error handler: answer with the mismatch right here.
      onError: (error, _body, req) => {
        const problem = new ResponseMismatchProblem(`${req.method} ${req.originalUrl} answered ${req.res?.statusCode}: ${error.message}`);
        if (req.res) sendProblem(req.res, problem, req.originalUrl.split('?')[0], req.requestId);
      },
    },
  });
}
