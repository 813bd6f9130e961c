// The agent facing a busy server: 503 and 429 with Retry-After are retried after the time the
// server asked for (a small HTTP front answers for the real server there); delete_after_success
// removes a file only once it is delivered.
import { createServer, request as httpRequest, type Server as HttpServer } from 'node:http';
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Bench, resultFile, startAgent, startBench, waitFor } from './agent-harness.ts';

const FRONT_PORT = 4504;

let bench: Bench;
beforeAll(async () => {
  bench = await startBench(4503);
});
afterAll(() => bench.close());

/** Answers the first `refusals` uploads itself (status + Retry-After), then passes everything to the real server. */
async function startFront(refusals: { status: number; retryAfter: string }[]) {
  const uploads: { at: number; status: number }[] = [];
  const server: HttpServer = createServer((req, res) => {
    const isUpload = req.method === 'POST' && req.url === '/api/v1/imports';
    const refusal = isUpload ? refusals.shift() : undefined;
    if (refusal) {
      uploads.push({ at: Date.now(), status: refusal.status });
      req.resume();
      res.writeHead(refusal.status, { 'content-type': 'application/problem+json', 'retry-after': refusal.retryAfter });
      res.end(JSON.stringify({ type: 'about:blank', title: 'Busy', status: refusal.status }));
      return;
    }
    const target = new URL(bench.url);
    const upstream = httpRequest(
      { host: target.hostname, port: target.port, path: req.url, method: req.method, headers: req.headers },
      (answer) => {
        if (isUpload) uploads.push({ at: Date.now(), status: answer.statusCode ?? 0 });
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      },
    );
    req.pipe(upstream);
  });
  await new Promise<void>((done) => server.listen(FRONT_PORT, done));
  return { uploads, close: () => new Promise<void>((done) => server.close(() => done())) };
}

describe('meltwire-agent and a busy server, and deleting after success', () => {
  it('waits for Retry-After after 503 and 429, then delivers the file once', async () => {
    const front = await startFront([
      { status: 503, retryAfter: '1' },
      { status: 429, retryAfter: '1' },
    ]);
    try {
      bench.writeConfig({ server_url: `http://localhost:${FRONT_PORT}`, retry_max_seconds: 5 });
      writeFileSync(join(bench.folder, 'K24-1001.csv'), resultFile('K24-1001-F1'));
      const run = startAgent(['--config', bench.configFile]);
      const deadline = Date.now() + 20_000;
      while (bench.ledger().length === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
      await run.stop();
      expect(front.uploads.map((u) => u.status)).toEqual([503, 429, 201]);
      // Retry-After: 1 (RFC 9110 §10.2.3, docs/references.md): each retry came at least a second later.
      expect(front.uploads[1].at - front.uploads[0].at).toBeGreaterThanOrEqual(950);
      expect(front.uploads[2].at - front.uploads[1].at).toBeGreaterThanOrEqual(950);
      expect((await bench.imports()).filter((i) => i.file_name === 'K24-1001.csv')).toHaveLength(1);
      expect(bench.ledger()).toEqual([expect.objectContaining({ outcome: 'sent' })]);
    } finally {
      await front.close();
    }
  });

  it('reports a delivery within seconds even with an hourly heartbeat', async () => {
    bench.writeConfig({ heartbeat_seconds: 3600 });
    const run = startAgent(['--config', bench.configFile]);
    try {
      await waitFor('the first heartbeat', async () => (await bench.feed()).state === 'alive');
      writeFileSync(join(bench.folder, 'K24-1004.csv'), resultFile('K24-1004-F1'));
      const feed = await waitFor('the delivery in the feed', async () => {
        const body = await bench.feed();
        return body.last_file?.name === 'K24-1004.csv' ? body : undefined;
      });
      expect(feed).toMatchObject({ state: 'alive', queue_length: 0 });
    } finally {
      await run.stop();
    }
  });

  it('deletes a file from the folder after delivery only when delete_after_success is set', async () => {
    bench.writeConfig({ delete_after_success: true });
    const path = join(bench.folder, 'K24-1003.csv');
    writeFileSync(path, resultFile('K24-1003-F1'));
    expect((await startAgent(['--config', bench.configFile, '--once']).exited).code).toBe(0);
    expect(existsSync(path)).toBe(false);
    expect(bench.ledger().filter((e) => e.path === path)).toEqual([expect.objectContaining({ outcome: 'sent' })]);
    expect((await bench.imports()).map((i) => i.file_name)).toContain('K24-1003.csv');
  });
});
