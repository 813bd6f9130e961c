// Validation problems say what is wrong in plain words, keep each field's location and zod code,
// and keep a message a schema states itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from '../../server/lib/zod.ts';
import { parseOrProblem } from '../../server/lib/readable-issues.ts';
import { ValidationProblem } from '../../server/lib/problems.ts';
import { createTestApp, expectProblem, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('readable validation messages', () => {
  it('names the field and the rule instead of zod defaults', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.post('/api/v1/api-keys').send({ name: '', scopes: [], expires_at: '14/03/2026' });
    expectProblem(res, 400);
    const { errors } = problemBody(res);
    expect(errors).toEqual(
      expect.arrayContaining([
        { location: 'body.name', message: 'name must not be empty', code: 'too_small' },
        { location: 'body.scopes', message: 'scopes must not be empty', code: 'too_small' },
        {
          location: 'body.expires_at',
          message: 'expires_at must be an ISO 8601 date and time with a zone, such as 2026-03-14T09:30:00Z',
          code: 'invalid_format',
        },
      ]),
    );
    expect(JSON.stringify(errors)).not.toMatch(/Too small|Invalid input|expected string/);
  });

  it('says what is missing, what type is expected, the limits and the allowed values', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const missing = problemBody(await agent.post('/api/v1/api-keys').send({ scopes: ['nonsense:read'] }));
    expect(missing.errors).toEqual(
      expect.arrayContaining([
        { location: 'body.name', message: 'name is required', code: 'invalid_type' },
        expect.objectContaining({
          location: 'body.scopes.0',
          code: 'invalid_value',
          message: expect.stringMatching(/^scopes\[0\] must be one of "/),
        }),
      ]),
    );
    const typed = problemBody(await agent.post('/api/v1/api-keys').send({ name: 42, scopes: ['samples:read'] }));
    expect(typed.errors).toEqual([{ location: 'body.name', message: 'name must be text', code: 'invalid_type' }]);
    const limit = problemBody(await agent.get('/api/v1/api-keys?limit=0'));
    expect(limit.errors).toEqual([
      expect.objectContaining({ location: 'query.limit', message: expect.stringMatching(/^limit must be at least 1$/) }),
    ]);
  });

  it("keeps the schema's own message", async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.post('/api/v1/api-keys').send({ name: 'twice', scopes: ['samples:read', 'samples:read'] });
    expect(problemBody(res).errors).toEqual([{ location: 'body.scopes', message: 'list each scope once', code: 'custom' }]);
  });

  it('names unknown fields of a strict object and items by position', () => {
    const schema = z.strictObject({ burns: z.array(z.object({ value: z.number().max(100) })) });
    let problem: unknown;
    try {
      parseOrProblem('body', schema, { burns: [{ value: 1 }, { value: 120 }], colour: 'red' });
    } catch (error) {
      problem = error;
    }
    expect(problem).toBeInstanceOf(ValidationProblem);
    expect((problem as ValidationProblem).extensions.errors).toEqual([
      { location: 'body.burns.1.value', message: 'value must be at most 100', code: 'too_big' },
      { location: 'body', message: 'unknown field "colour": the object does not take it', code: 'unrecognized_keys' },
    ]);
  });
});
