// Tests only: checks every JSON response (problems included) against the OpenAPI document with
// express-openapi-validator. A mismatch becomes a 500 problem naming it, so the test that
// produced the response fails. The package is a devDependency, so it is loaded only when asked.
import { createRequire } from 'node:module';
import type { RequestHandler } from 'express';
import type * as OpenApiValidator from 'express-openapi-validator';
import type { AnyRoute } from './route.ts';
import { buildOpenApiDocument } from '../openapi/document.ts';
import { ProblemError } from './problem.ts';

export class ResponseMismatchProblem extends ProblemError {
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
      onError: (error, _body, req) => {
        throw new ResponseMismatchProblem(`${req.method} ${req.originalUrl} answered ${req.res?.statusCode}: ${error.message}`);
      },
    },
  });
}
