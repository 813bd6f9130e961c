import { describe, expect, it } from 'vitest';
import { problemFromResponse } from '../../../src/api/problem.ts';

describe('problemFromResponse', () => {
  it('keeps the standard members apart from the extensions a client may need', () => {
    const body = {
      type: '/problems/unprocessable',
      title: 'The request cannot be processed',
      status: 422,
      detail: '1 value(s) cannot be read, so nothing was imported.',
      request_id: 'req-1',
      errors: [{ location: 'file:line 3:Mn %', message: 'not a number', code: 'invalid_value' }],
      errors_total: 1,
      issues: [{ line: 3, column: 'Mn %', message: 'not a number', code: 'invalid_value' }],
    };
    const problem = problemFromResponse(422, 'Unprocessable Entity', body);
    expect(problem.status).toBe(422);
    expect(problem.message).toBe(body.detail);
    expect(problem.problem.errors).toEqual(body.errors);
    expect(problem.extensions).toEqual({ request_id: 'req-1', errors_total: 1, issues: body.issues });
  });

  it('makes a readable problem of an answer without a problem body', () => {
    const problem = problemFromResponse(502, 'Bad Gateway', undefined);
    expect(problem.problem).toMatchObject({ type: 'about:blank', title: 'Bad Gateway', status: 502 });
    expect(problemFromResponse(500, '', 'oops').problem.title).toBe('Request failed');
  });
});
