// A local webhook receiver built on node:http, the only fake in the webhook tests: it records
// every request and answers as the test says (a status per attempt, or hanging).
import { createServer, type IncomingHttpHeaders, type Server } from 'node:http';

export interface Received {
  headers: IncomingHttpHeaders;
  body: string;
  at: number;
}

export interface Answer {
  status: number;
  headers?: Record<string, string>;
  body?: string;
  /** Never answer (the request stays open until the client gives up). */
  hang?: boolean;
}

export interface Receiver {
  url: string;
  received: Received[];
  /** Waits until at least `count` requests have arrived. */
  waitFor(count: number, timeoutMs?: number): Promise<Received[]>;
  close(): Promise<void>;
}

export async function startReceiver(
  port: number,
  answer: (n: number, request: Received) => Answer = () => ({ status: 204 }),
): Promise<Receiver> {
  const received: Received[] = [];
  const server: Server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const request = { headers: req.headers, body: Buffer.concat(chunks).toString('utf8'), at: Date.now() };
      received.push(request);
      const reply = answer(received.length, request);
      if (reply.hang) return;
      res.writeHead(reply.status, reply.headers).end(reply.body ?? '');
    });
  });
  await new Promise<void>((resolve, reject) => server.once('error', reject).listen(port, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${port}/hooks`,
    received,
    async waitFor(count, timeoutMs = 5000) {
      const deadline = Date.now() + timeoutMs;
      while (received.length < count) {
        if (Date.now() > deadline) throw new Error(`the receiver got ${received.length} of ${count} requests`);
        await new Promise((resolve) => setTimeout(resolve, 10));
      }
      return received;
    },
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
