// Per-caller budgets: each API key, signed-in user and anonymous address has its own.
// Header syntax from draft-ietf-httpapi-ratelimit-headers-08 (structured fields):
//   RateLimit-Policy: "<policy>";q=<quota>;w=<window seconds>;pk=:<partition key, base64>:
//   RateLimit: "<policy>";r=<remaining>;t=<seconds to reset>
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, issueKey, problemBody, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp({ rateLimitPerMinute: 3 });
});
afterAll(() => t.close());

const withKey = (secret: string) => request(t.app).get('/api/v1/samples').set('authorization', `Bearer ${secret}`);

describe('API rate limit per caller', () => {
  it('counts down in RateLimit headers and states the policy in RateLimit-Policy', async () => {
    const key = await issueKey(t, ['samples:read']);
    const remaining: string[] = [];
    for (let i = 0; i < 3; i++) {
      const res = await withKey(key.secret);
      expect(res.status).toBe(200);
      expect(res.headers['ratelimit-policy']).toMatch(/^"api"; q=3; w=60; pk=:[A-Za-z0-9+/]+=*:$/);
      remaining.push(res.headers.ratelimit);
    }
    expect(remaining.map((h) => h.match(/r=(\d+)/)?.[1])).toEqual(['2', '1', '0']);
    for (const header of remaining) expect(header).toMatch(/^"api"; r=\d+; t=([1-9]|[1-5]\d|60)$/);
  });

  it('answers the call over budget with 429 problem+json and Retry-After', async () => {
    const key = await issueKey(t, ['samples:read']);
    for (let i = 0; i < 3; i++) expect((await withKey(key.secret)).status).toBe(200);
    const res = await withKey(key.secret);
    expectProblem(res, 429);
    expect(problemBody(res)).toMatchObject({ type: '/problems/rate-limited', title: 'Too many requests' });
    const retryAfter = Number(res.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(60);
    expect(res.headers.ratelimit).toMatch(/r=0/);
  });

  it('gives two keys of the same user separate budgets', async () => {
    const { user } = await signedInAgent(t, 'integrator');
    const first = await issueKey(t, ['samples:read'], { owner: user });
    const second = await issueKey(t, ['samples:read'], { owner: user });
    const partition = (res: request.Response) => /pk=(:[^:]+:)/.exec(res.headers['ratelimit-policy'])?.[1];
    const firstCall = await withKey(first.secret);
    for (let i = 0; i < 2; i++) expect((await withKey(first.secret)).status).toBe(200);
    expectProblem(await withKey(first.secret), 429);
    const other = await withKey(second.secret);
    expect(other.status).toBe(200);
    expect(other.headers.ratelimit).toMatch(/r=2/);
    expect(partition(other)).not.toBe(partition(firstCall));
  });

  it('gives a signed-in user a budget of their own, apart from their keys', async () => {
    const { agent, user } = await signedInAgent(t, 'integrator');
    const key = await issueKey(t, ['samples:read'], { owner: user });
    for (let i = 0; i < 3; i++) expect((await withKey(key.secret)).status).toBe(200);
    expectProblem(await withKey(key.secret), 429);
    expect((await agent.get('/api/v1/samples')).status).toBe(200);
  });
});
