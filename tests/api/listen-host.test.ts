// Where the server listens (server/index.ts listen, HOST in server/config.ts): loopback by default,
// so a demo is not reachable from the network; the URL it returns is one that answers.
import { networkInterfaces } from 'node:os';
import { afterEach, describe, expect, it } from 'vitest';
import { listen, type RunningServer } from '../../server/index.ts';
import { createLogger } from '../../server/logger.ts';
import { createTestApp } from '../helpers/test-app.ts';

let running: RunningServer | undefined;
afterEach(async () => {
  await running?.stop();
  running = undefined;
});

/** An IPv4 address of this machine other than loopback, when it has one. */
function externalIPv4(): string | undefined {
  return Object.values(networkInterfaces())
    .flat()
    .find((entry) => entry && entry.family === 'IPv4' && !entry.internal)?.address;
}

describe('listen', () => {
  it('listens on 127.0.0.1 unless told otherwise and returns a URL that answers', async () => {
    const t = await createTestApp();
    running = await listen(t.app, t.db, createLogger('silent'), 0);
    expect(running.server.address()).toMatchObject({ address: '127.0.0.1' });
    expect(running.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    const response = await fetch(`${running.url}/api/v1/health`);
    expect(response.status).toBe(200);
    expect(response.headers.get('content-type')).toMatch(/^application\/json/);

    // Not reachable on the machine's network address.
    const external = externalIPv4();
    if (external)
      await expect(fetch(`http://${external}:${(running.server.address() as { port: number }).port}/api/v1/health`)).rejects.toThrow();
  });

  it('listens on every interface with HOST=0.0.0.0 and returns a loopback URL to reach it', async () => {
    const t = await createTestApp();
    running = await listen(t.app, t.db, createLogger('silent'), 0, undefined, '0.0.0.0');
    expect(running.server.address()).toMatchObject({ address: '0.0.0.0' });
    expect(running.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
    expect((await fetch(`${running.url}/api/v1/health`)).status).toBe(200);
    const external = externalIPv4();
    if (external)
      expect((await fetch(`http://${external}:${(running.server.address() as { port: number }).port}/api/v1/health`)).status).toBe(200);
  });
});
