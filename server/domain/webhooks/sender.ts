// One HTTP POST of a delivery: node:http(s) (which never follows redirects), a 15 s limit on the
// whole exchange, the first 2 KB of the answer kept. Unless private addresses are allowed, an IP
// literal is checked here and a name at connect time (guardedLookup), on the address connected to.
import http from 'node:http';
import https from 'node:https';
import { isIP } from 'node:net';
import { blockedReason, guardedLookup, hostOf } from './address-guard.ts';
import { type AttemptResult, parseRetryAfter } from './retry-policy.ts';

export const DELIVERY_TIMEOUT_MS = 15_000;
export const RESPONSE_EXCERPT_BYTES = 2048;

export interface SendResult extends AttemptResult {
  durationMs: number;
  excerpt: string | null;
  /** The worker is stopping: the attempt did not finish and is not recorded. */
  aborted?: boolean;
}

export interface Sender {
  send(url: string, headers: Record<string, string>, body: string, signal: AbortSignal): Promise<SendResult>;
  close(): void;
}

export function createSender(options: {
  allowPrivate: boolean;
  userAgent: string;
  timeoutMs?: number;
  maxSocketsPerHost?: number;
}): Sender {
  // Own agents, so that sockets made under one guard setting are never reused under another.
  const maxSockets = options.maxSocketsPerHost ?? 32;
  const agents = { http: new http.Agent({ keepAlive: true, maxSockets }), https: new https.Agent({ keepAlive: true, maxSockets }) };
  const timeoutMs = options.timeoutMs ?? DELIVERY_TIMEOUT_MS;

  function send(target: string, headers: Record<string, string>, body: string, signal: AbortSignal): Promise<SendResult> {
    const started = performance.now();
    const done = (result: Omit<SendResult, 'durationMs'>): SendResult => ({ ...result, durationMs: performance.now() - started });
    const url = new URL(target);
    const host = hostOf(url);
    if (!options.allowPrivate && isIP(host)) {
      const reason = blockedReason(host);
      if (reason)
        return Promise.resolve(
          done({ permanent: true, excerpt: null, error: `${host} is a ${reason} address; webhooks may not reach it` }),
        );
    }
    const secure = url.protocol === 'https:';
    return new Promise((resolve) => {
      let settled = false;
      const finish = (result: Omit<SendResult, 'durationMs'>) => {
        if (settled) return;
        settled = true;
        clearTimeout(timer);
        signal.removeEventListener('abort', onAbort);
        resolve(done(result));
      };
      const request = (secure ? https : http).request(url, {
        method: 'POST',
        agent: secure ? agents.https : agents.http,
        headers: {
          ...headers,
          'content-type': 'application/json',
          'content-length': Buffer.byteLength(body),
          'user-agent': options.userAgent,
        },
        ...(options.allowPrivate ? {} : { lookup: guardedLookup }),
      });
      const timer = setTimeout(() => request.destroy(new Error(`no complete answer within ${timeoutMs / 1000} s`)), timeoutMs);
      const onAbort = () => {
        request.destroy();
        finish({ aborted: true, excerpt: null, error: 'worker stopped' });
      };
      signal.addEventListener('abort', onAbort, { once: true });
      request.on('error', (error: NodeJS.ErrnoException) =>
        finish({ excerpt: null, error: error.message.slice(0, 500), permanent: error.code === 'EBLOCKEDADDRESS' }),
      );
      request.on('response', (response) => {
        const chunks: Buffer[] = [];
        let size = 0;
        const complete = () =>
          finish({
            status: response.statusCode,
            excerpt: Buffer.concat(chunks).subarray(0, RESPONSE_EXCERPT_BYTES).toString('utf8'),
            retryAfterSeconds: parseRetryAfter(response.headers['retry-after']),
          });
        response.on('data', (chunk: Buffer) => {
          if (size < RESPONSE_EXCERPT_BYTES) chunks.push(chunk);
          size += chunk.length;
          if (size >= RESPONSE_EXCERPT_BYTES) {
            complete();
            response.destroy();
          }
        });
        response.on('end', complete);
        response.on('error', complete);
      });
      request.end(body);
    });
  }

  return {
    send,
    close() {
      agents.http.destroy();
      agents.https.destroy();
    },
  };
}
