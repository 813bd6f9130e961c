// The API tests validate every JSON response against the OpenAPI document. This file proves the
// check bites: a route answering outside its documented shape — a body or a problem — fails.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ConflictProblem } from '../../server/lib/problems.ts';
import type { AnyRoute } from '../../server/http/route.ts';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { createTestApp, expectProblem, problemBody, type TestApp } from '../helpers/test-app.ts';

function replaceHandler(operationId: string, handler: AnyRoute['handler']): AnyRoute[] {
  return v1Routes.map((route) => (route.operationId === operationId ? { ...route, handler } : route));
}

let wrongBody: TestApp;
let undocumentedProblem: TestApp;
beforeAll(async () => {
  // GET /health documents `status`, `version`, `database` and `time`; this one forgets most of them.
  wrongBody = await createTestApp({}, { routes: replaceHandler('getHealth', ({ res }) => void res.json({ status: 'melting' })) });
  // GET /health documents 200, 401, 429, 503 and 500; a 409 is not among them.
  undocumentedProblem = await createTestApp(
    {},
    {
      routes: replaceHandler('getHealth', () => {
        throw new ConflictProblem('not a documented answer here');
      }),
    },
  );
});
afterAll(async () => {
  await wrongBody.close();
  await undocumentedProblem.close();
});

describe('response validation in tests', () => {
  it('turns a body that does not match its schema into a 500 naming the mismatch', async () => {
    const res = await request(wrongBody.app).get('/api/v1/health');
    expectProblem(res, 500);
    expect(problemBody(res)).toMatchObject({ type: '/problems/response-mismatch' });
    expect(problemBody(res).detail).toMatch(/GET \/api\/v1\/health answered 200: .*must have required property 'version'/);
  });

  it('checks problem responses too: an undocumented status fails', async () => {
    const res = await request(undocumentedProblem.app).get('/api/v1/health');
    expectProblem(res, 500);
    expect(problemBody(res).detail).toMatch(/answered 409: no schema defined for status code '409'/);
  });

  it('lets documented responses through unchanged', async () => {
    const fine = await createTestApp();
    try {
      const res = await request(fine.app).get('/api/v1/health');
      expect(res.status).toBe(200);
      expect(res.body.status).toBe('ok');
    } finally {
      await fine.close();
    }
  });
});
