import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, expectProblem, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('GET /api/v1/audit-events', () => {
  it('records sign-in and invitations with actor, action, target and request id', async () => {
    const { agent, user } = await signedInAgent(t, 'admin');
    await agent
      .post('/api/v1/users')
      .set('x-request-id', 'audit-check-1')
      .send({ email: 'audited@kestrelbend.test', name: 'Audited', role: 'viewer' });
    const res = await agent.get('/api/v1/audit-events').query({ actor_id: user.id });
    expect(res.status).toBe(200);
    const [invited, signedIn] = res.body.data;
    expect(invited).toMatchObject({
      action: 'user.invited',
      actor: { type: 'user', id: user.id, label: user.email },
      target: { type: 'user' },
      request_id: 'audit-check-1',
      after: { email: 'audited@kestrelbend.test', role: 'viewer' },
    });
    expect(signedIn).toMatchObject({ action: 'session.signed_in' });
    expect(invited.occurred_at >= signedIn.occurred_at).toBe(true);
  });

  it('pages newest first without gaps or repeats', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    for (let i = 0; i < 5; i++)
      await agent.post('/api/v1/users').send({ email: `page${i}@kestrelbend.test`, name: `P ${i}`, role: 'viewer' });
    const ids: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await agent.get('/api/v1/audit-events').query({ limit: 3, ...(cursor ? { cursor } : {}) });
      ids.push(...page.body.data.map((e: { id: string }) => e.id));
      cursor = page.body.next_cursor ?? undefined;
    } while (cursor);
    const expected = await t
      .db('audit_events')
      .orderBy([
        { column: 'occurred_at', order: 'desc' },
        { column: 'id', order: 'desc' },
      ])
      .pluck('id');
    expect(ids).toEqual(expected);
  });

  it('is closed to roles without audit:read', async () => {
    const { agent } = await signedInAgent(t, 'analyst');
    expectProblem(await agent.get('/api/v1/audit-events'), 403);
    const { agent: manager } = await signedInAgent(t, 'manager');
    expect((await manager.get('/api/v1/audit-events')).status).toBe(200);
  });
});
