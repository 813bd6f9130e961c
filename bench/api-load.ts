// Load shared by the API benches: invented pushes of 3 burns × 25 elements, autocannon runs and
// timed pushes (sequential, then 10 clients).
import { Agent, request as httpRequest } from 'node:http';
import autocannon from 'autocannon';
import { WIDE_FILE_ELEMENTS } from './generate-wide-file.ts';

export const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * q))];

/** Deterministic invented burns: 3 × 25 elements (Fe is the balance, not sent). */
export function burnsOf(i: number) {
  return [0, 1, 2].map((b) => ({
    values: Object.fromEntries(
      WIDE_FILE_ELEMENTS.filter((e) => e !== 'Fe').map((e, k) => [e, ((((i * 7 + b * 3 + k) % 97) + 3) / 1000).toFixed(4)]),
    ),
  }));
}

export interface Target {
  base: string;
  headers: Record<string, string>;
  instrumentId: string;
  methodId: string;
}

export const pushBody = (target: Target, code: string, i: number) =>
  JSON.stringify({ sample_code: code, instrument_id: target.instrumentId, method_id: target.methodId, burns: burnsOf(i) });

/** Stores `count` samples through POST /samples/batch, 500 at a time. */
export async function fill(target: Target, count: number, prefix: string): Promise<void> {
  for (let i = 0; i < count; i += 500) {
    const samples = Array.from(
      { length: Math.min(500, count - i) },
      (_, j) => JSON.parse(pushBody(target, `${prefix}-${i + j}`, i + j)) as unknown,
    );
    const res = await fetch(`${target.base}/api/v1/samples/batch`, {
      method: 'POST',
      headers: target.headers,
      body: JSON.stringify({ samples }),
    });
    if (res.status !== 201) throw new Error(`batch: ${res.status} ${await res.text()}`);
  }
}

/** autocannon at 50 connections (split over the URLs given) for `seconds`; requests/s summed, worst p99. */
export async function cannon(urls: string[], seconds: number, headers: Record<string, string> = {}) {
  const results = await Promise.all(
    urls.map((url) => autocannon({ url, connections: Math.round(50 / urls.length), duration: seconds, headers })),
  );
  for (const [i, result] of results.entries()) if (result.non2xx > 0) throw new Error(`${urls[i]}: ${result.non2xx} answers were not 2xx`);
  return { rps: results.reduce((sum, r) => sum + r.requests.average, 0), p99: Math.max(...results.map((r) => r.latency.p99)) };
}

const agent = new Agent({ keepAlive: true, maxSockets: 10 });

function post(url: string, headers: Record<string, string>, body: string): Promise<number> {
  const started = performance.now();
  return new Promise((resolve, reject) => {
    const req = httpRequest(url, { method: 'POST', headers, agent }, (res) => {
      res.resume();
      res.on('end', () => (res.statusCode === 201 ? resolve(performance.now() - started) : reject(new Error(`push: ${res.statusCode}`))));
    });
    req.on('error', reject);
    req.end(body);
  });
}

/** `count` pushes one after another, then `count` from 10 clients (spread over the URLs). */
export async function timedPushes(
  urls: string[],
  headers: Record<string, string>,
  count: number,
  body: (code: string, i: number) => string,
  tag: string,
) {
  const sequential: number[] = [];
  for (let i = 0; i < count; i++) sequential.push(await post(urls[0], headers, body(`${tag}-S${i}`, i)));
  const concurrent: number[] = [];
  const started = performance.now();
  await Promise.all(
    Array.from({ length: 10 }, async (_, c) => {
      for (let i = 0; i < count / 10; i++) concurrent.push(await post(urls[c % urls.length], headers, body(`${tag}-C${c}-${i}`, i)));
    }),
  );
  const perSecond = (concurrent.length / (performance.now() - started)) * 1000;
  return { p50: quantile(sequential, 0.5), p99: quantile(concurrent, 0.99), perSecond };
}

export function closeLoadAgent(): void {
  agent.destroy();
}
