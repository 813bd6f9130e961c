// Graceful shutdown (server/index.ts): stop taking connections, finish the request in flight,
// then close the database.
import { describe, expect, it } from 'vitest';
import { listen } from '../../server/index.ts';
import { createLogger } from '../../server/logger.ts';
import { v1Routes } from '../../server/routes/v1/index.ts';
import { createTestApp, issueKey } from '../helpers/test-app.ts';
import { testRoutes } from '../helpers/test-routes.ts';

describe('graceful shutdown', () => {
  it('finishes the request in flight, refuses new connections, then closes the database', async () => {
    const extra = testRoutes();
    const t = await createTestApp({}, { routes: [...v1Routes, ...extra.routes] });
    const { secret } = await issueKey(t, ['samples:write']);
    const running = await listen(t.app, t.db, createLogger('silent'), 0);
    const gate = extra.hold();
    const inFlight = fetch(`${running.url}/api/v1/test/slow-write`, {
      method: 'POST',
      headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
      body: JSON.stringify({ value: 'x' }),
    });
    await gate.inside;

    const stopped = running.stop();
    await new Promise((resolve) => setTimeout(resolve, 50));
    await expect(fetch(`${running.url}/api/v1/health`)).rejects.toThrow();

    gate.release();
    const response = await inFlight;
    expect(response.status).toBe(201);
    await stopped;
    await expect(t.db.raw('select 1')).rejects.toThrow();
    await t.smtp.close();
  });
});
