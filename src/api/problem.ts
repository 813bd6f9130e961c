import type { components } from './schema';

export type FieldError = components['schemas']['FieldError'];
export type ProblemBody = Pick<components['schemas']['Problem'], 'type' | 'title' | 'status' | 'detail' | 'errors'>;

/** A failed API call, carrying the RFC 9457 problem the server sent. */
export class ApiProblem extends Error {
  readonly problem: ProblemBody;

  constructor(problem: ProblemBody) {
    super(problem.detail ?? problem.title);
    this.problem = problem;
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
    return (this.problem.errors ?? []).filter((e) => !fields.some((f) => e.location === `body.${f}` || e.location.startsWith(`body.${f}.`)));
  }
}

export function isProblem(error: unknown, status?: number): error is ApiProblem {
  return error instanceof ApiProblem && (status === undefined || error.status === status);
}
