// RFC 9457 problem details: one error family, each class carrying its status and stable type URI.
export interface FieldError {
  /** JSON pointer-ish location: "body.email", "query.limit", "file:line 12:Mn" */
  location: string;
  message: string;
  code?: string;
}

export interface ProblemBody {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  errors?: FieldError[];
  [extension: string]: unknown;
}

export const PROBLEM_CONTENT_TYPE = 'application/problem+json';
const TYPE_BASE = '/problems/';

export class ProblemError extends Error {
  constructor(
    public readonly status: number,
    public readonly slug: string,
    public readonly title: string,
    detail?: string,
    public readonly extensions: Record<string, unknown> = {},
  ) {
    super(detail ?? title);
    this.name = 'ProblemError';
  }

  get detail(): string | undefined {
    return this.message === this.title ? undefined : this.message;
  }

  toBody(instance?: string): ProblemBody {
    return {
      type: `${TYPE_BASE}${this.slug}`,
      title: this.title,
      status: this.status,
      ...(this.detail ? { detail: this.detail } : {}),
      ...(instance ? { instance } : {}),
      ...this.extensions,
    };
  }
}

export class ValidationProblem extends ProblemError {
  constructor(errors: FieldError[], detail = 'The request is not valid; see errors[] for each field.') {
    super(400, 'validation-failed', 'Request validation failed', detail, { errors });
  }
}

export class MalformedJsonProblem extends ProblemError {
  constructor() {
    super(400, 'malformed-json', 'Malformed JSON body', 'The request body is not valid JSON.');
  }
}

/** Objects and arrays nested deeper than the server reads (see server/http/json-body.ts). */
export class JsonTooDeepProblem extends ProblemError {
  constructor(maxDepth: number) {
    super(400, 'json-too-deep', 'JSON body nested too deeply', `The body nests objects and arrays more than ${maxDepth} levels deep.`, {
      max_depth: maxDepth,
    });
  }
}

/** A body that is not what its headers say: not gzip though sent as gzip, broken multipart. */
export class MalformedBodyProblem extends ProblemError {
  constructor(title: string, detail: string) {
    super(400, 'malformed-body', title, detail);
  }
}

/** A path or query that cannot be decoded (percent-encoding such as "%ZZ"). */
export class MalformedUrlProblem extends ProblemError {
  constructor(detail: string) {
    super(400, 'malformed-url', 'Malformed URL', detail);
  }
}

export class UnauthorizedProblem extends ProblemError {
  constructor(detail = 'Sign in or send an API key as "Authorization: Bearer <key>".') {
    super(401, 'unauthorized', 'Authentication required', detail);
  }
}

export class ForbiddenProblem extends ProblemError {
  constructor(detail = 'Your role or API key does not allow this action.', extensions: Record<string, unknown> = {}) {
    super(403, 'forbidden', 'Not allowed', detail, extensions);
  }
}

export class CrossSiteProblem extends ProblemError {
  constructor(detail: string) {
    super(403, 'cross-site-request', 'Cross-site request refused', detail);
  }
}

export class NotFoundProblem extends ProblemError {
  constructor(detail = 'No such resource.') {
    super(404, 'not-found', 'Not found', detail);
  }
}

export class ConflictProblem extends ProblemError {
  constructor(detail: string, extensions: Record<string, unknown> = {}) {
    super(409, 'conflict', 'Conflict with the current state', detail, extensions);
  }
}

export class PayloadTooLargeProblem extends ProblemError {
  constructor(limit: string) {
    super(413, 'payload-too-large', 'Request body too large', `The body exceeds the limit of ${limit}.`);
  }
}

export class UnprocessableProblem extends ProblemError {
  constructor(detail: string, errors?: FieldError[]) {
    super(422, 'unprocessable', 'The request cannot be processed', detail, errors ? { errors } : {});
  }
}

export class RateLimitedProblem extends ProblemError {
  constructor(detail = 'Too many requests; retry after the time given in Retry-After.') {
    super(429, 'rate-limited', 'Too many requests', detail);
  }
}

export class InternalProblem extends ProblemError {
  constructor() {
    super(500, 'internal', 'Internal server error', 'Something went wrong on our side; the request id identifies it in the logs.');
  }
}
