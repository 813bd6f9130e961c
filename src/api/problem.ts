import type { components } from './schema';

export type FieldError = components['schemas']['FieldError'];
export type ProblemBody = Pick<components['schemas']['Problem'], 'type' | 'title' | 'status' | 'detail' | 'errors'>;

/** A failed API call, carrying the RFC 9457 problem the server sent. */
export class ApiProblem extends Error {
  readonly problem: ProblemBody;
  /** Members beyond the standard ones (e.g. `issues` of a rejected file, `limit_bytes` of a 413). */
  readonly extensions: Record<string, unknown>;

  constructor(problem: ProblemBody, extensions: Record<string, unknown> = {}) {
    super(problem.detail ?? problem.title);
    this.problem = problem;
    this.extensions = extensions;
  }

  get status(): number {
    return this.problem.status;
  }

  /** The message for one form field: errors located at body.<field> (or deeper). */
  fieldError(field: string): string | undefined {
    return this.problem.errors?.find((e) => e.location === `body.${field}` || e.location.startsWith(`body.${field}.`))?.message;
  }

  /** Errors that no named field claims, for a message above the form. */
  otherErrors(fields: string[]): FieldError[] {
    return (this.problem.errors ?? []).filter(
      (e) => !fields.some((f) => e.location === `body.${f}` || e.location.startsWith(`body.${f}.`)),
    );
  }
}

export function isProblem(error: unknown, status?: number): error is ApiProblem {
  return error instanceof ApiProblem && (status === undefined || error.status === status);
}

/** The problem of a failed response, from its (possibly missing or non-problem) JSON body. */
export function problemFromResponse(status: number, statusText: string, body: unknown): ApiProblem {
  const {
    type,
    title,
    status: _status,
    detail,
    errors,
    ...extensions
  } = (body !== null && typeof body === 'object' ? body : {}) as Partial<ProblemBody> & Record<string, unknown>;
  return new ApiProblem(
    {
      type: typeof type === 'string' ? type : 'about:blank',
      title: typeof title === 'string' ? title : statusText || 'Request failed',
      status,
      detail,
      errors,
    },
    extensions,
  );
}

export const NETWORK_PROBLEM: ProblemBody = {
  type: 'network',
  title: 'The server cannot be reached',
  status: 0,
  detail: 'Check the connection and try again.',
};
