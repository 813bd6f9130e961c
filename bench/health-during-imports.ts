// Does an import stall the server? GET /api/v1/health latency on the real app, first with
// nothing else running (the floor), then while three different 20,000-burn files are uploaded
// in parallel. Reports p50/p99 of both, the p99 ratio and the imports' total time.
// Run: npm run bench:health (BENCH_BURNS, BENCH_UPLOADS change the load).
import { createApiKey } from '../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../server/domain/auth/auth.service.ts';
import { findInstrumentByCode } from '../server/domain/instruments/instruments.repository.ts';
import { insertMethod } from '../server/domain/methods/methods.repository.ts';
import { DEFAULT_DRIFT_LIMITS, DEFAULT_REPORTING } from '../server/domain/methods/methods.schemas.ts';
import { findUserByEmail } from '../server/domain/users/users.repository.ts';
import { newId } from '../server/lib/ids.ts';
import { nowIso } from '../server/lib/time.ts';
import { DEMO_USERS } from '../server/seed/demo-users.ts';
import { startLiveServer } from '../tests/helpers/live-server.ts';
import { WIDE_FILE_ELEMENTS, wideCsv } from './generate-wide-file.ts';

const BURNS = Number(process.env.BENCH_BURNS ?? 20_000);
const UPLOADS = Number(process.env.BENCH_UPLOADS ?? 3);
const FLOOR_CALLS = 300;

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

function summary(latencies: number[]) {
  const sorted = [...latencies].sort((a, b) => a - b);
  return { n: sorted.length, p50: percentile(sorted, 50), p99: percentile(sorted, 99), max: sorted[sorted.length - 1] };
}

const ms = (value: number) => `${value.toFixed(1)} ms`;

async function timedHealth(url: string): Promise<number> {
  const started = performance.now();
  const res = await fetch(`${url}/api/v1/health`);
  await res.arrayBuffer();
  if (res.status !== 200) throw new Error(`/health answered ${res.status}`);
  return performance.now() - started;
}

async function main(): Promise<void> {
  const server = await startLiveServer({
    console: false,
    validateResponses: false,
    config: { importMaxBytes: 100 * 1024 * 1024, rateLimitPerMinute: 10_000_000 },
  });
  try {
    const instrument = (await findInstrumentByCode(server.db, 'OES-1'))!;
    const method = {
      id: newId('mth'),
      code: 'FE-BENCH',
      name: 'Benchmark method (Fe base, every element of the generated file)',
      matrix: 'Fe',
      default_unit: '%' as const,
      drift_limits: DEFAULT_DRIFT_LIMITS,
      reporting: DEFAULT_REPORTING,
      created_at: nowIso(),
      updated_at: nowIso(),
      elements: WIDE_FILE_ELEMENTS.map((element) => ({
        element,
        decimals: 4,
        working_range_low: null,
        working_range_high: null,
        detection_limit: null,
        repeatability_sd: '0.01',
      })),
    };
    await insertMethod(server.db, method);
    const admin = await findUserByEmail(server.db, DEMO_USERS[0].email);
    const key = await createApiKey(server.ctx, sessionAuthContext(admin!, 'bench'), { name: 'bench', scopes: ['imports:write'] });

    // Distinct seeds: identical bytes would be deduplicated by their SHA-256 instead of imported.
    const files = Array.from({ length: UPLOADS }, (_, i) => wideCsv(BURNS, { seed: 412 + i }));
    console.log(
      `files: ${UPLOADS} × ${BURNS} burns × ${WIDE_FILE_ELEMENTS.length} elements, ${(Buffer.byteLength(files[0]) / 1e6).toFixed(1)} MB each`,
    );

    for (let i = 0; i < 20; i++) await timedHealth(server.url); // warm-up
    const floorLatencies: number[] = [];
    for (let i = 0; i < FLOOR_CALLS; i++) floorLatencies.push(await timedHealth(server.url));
    const floor = summary(floorLatencies);

    const started = performance.now();
    let running = UPLOADS;
    const uploads = files.map(async (text, i) => {
      const form = new FormData();
      form.set('instrument_id', instrument.id);
      form.set('method_id', method.id);
      form.set('file', new Blob([text], { type: 'text/csv' }), `bench-${i}.csv`);
      const res = await fetch(`${server.url}/api/v1/imports`, {
        method: 'POST',
        body: form,
        headers: { authorization: `Bearer ${key.secret}` },
      });
      const body = await res.text();
      running -= 1;
      if (res.status !== 201) throw new Error(`upload ${i} answered ${res.status}: ${body.slice(0, 300)}`);
      return performance.now() - started;
    });
    const duringLatencies: number[] = [];
    const probing = (async () => {
      while (running > 0) duringLatencies.push(await timedHealth(server.url));
    })();
    const finished = await Promise.all(uploads);
    await probing;
    const total = Math.max(...finished);
    const during = summary(duringLatencies);

    console.log(`floor   /health  n=${floor.n}  p50 ${ms(floor.p50)}  p99 ${ms(floor.p99)}  max ${ms(floor.max)}`);
    console.log(`imports /health  n=${during.n}  p50 ${ms(during.p50)}  p99 ${ms(during.p99)}  max ${ms(during.max)}`);
    console.log(`ratio   p99 during imports / floor p99 = ${(during.p99 / floor.p99).toFixed(1)}  (target: p99 < 50 ms)`);
    console.log(`imports ${UPLOADS} parallel uploads finished in ${(total / 1000).toFixed(1)} s`);
  } finally {
    await server.stop();
  }
}

await main();
