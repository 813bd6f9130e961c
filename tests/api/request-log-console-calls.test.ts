// The console's own calls (its pages loading and polling) are recorded but left out of the
// Request log unless asked for; integrations' calls, replays and Try it out stay listed.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, issueKey, signedInAgent, type TestApp } from '../helpers/test-app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

interface Summary {
  request_id: string;
  from_console: boolean;
  caller: { type: string };
}

async function listed(agent: request.Agent, query = ''): Promise<Summary[]> {
  const res = await agent.get(`/api/v1/request-log?limit=200${query}`);
  expect(res.status).toBe(200);
  return res.body.data;
}

describe("the console's own calls in the request log", () => {
  it('hides signed-in calls sent by the console client by default, and lists them with include_console=true', async () => {
    const { agent, user } = await signedInAgent(t, 'admin');
    const key = await issueKey(t, ['samples:read', 'request-log:read'], { owner: user });
    await agent.get('/api/v1/samples').set('x-meltwire-client', 'console').set('x-request-id', 'console-poll');
    await agent.get('/api/v1/samples').set('x-request-id', 'try-it-out');
    // A key is an integration's, whatever it claims to be.
    await request(t.app)
      .get('/api/v1/samples')
      .set('authorization', `Bearer ${key.secret}`)
      .set('x-meltwire-client', 'console')
      .set('x-request-id', 'key-claims-console');

    const byDefault = (await listed(agent)).map((e) => e.request_id);
    expect(byDefault).toEqual(expect.arrayContaining(['try-it-out', 'key-claims-console']));
    expect(byDefault).not.toContain('console-poll');

    const all = await listed(agent, '&include_console=true');
    expect(all.find((e) => e.request_id === 'console-poll')).toMatchObject({ from_console: true, caller: { type: 'user' } });
    expect(all.find((e) => e.request_id === 'try-it-out')).toMatchObject({ from_console: false });
    expect(all.find((e) => e.request_id === 'key-claims-console')).toMatchObject({ from_console: false, caller: { type: 'api_key' } });
  });

  it('refuses an include_console that is not true or false, in words', async () => {
    const { agent } = await signedInAgent(t, 'admin');
    const res = await agent.get('/api/v1/request-log?include_console=yes');
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([
      { location: 'query.include_console', message: 'include_console must be one of "true", "false"', code: 'invalid_value' },
    ]);
  });
});
