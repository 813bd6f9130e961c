// `npm run bench:webhooks`: 1,000 sample.created events (pushed in batches of 10, as an instrument
// PC would) fanned out to 3 local receivers by the real delivery worker on a SQLite file. Prints
// the time from the first push to the last of the 3,000 receipts, and the median and p99 from each
// push's commit to each receipt. Targets (issue 10): all in under 5 s, p99 under 1 s, idle machine.
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { join } from 'node:path';
import { createApp } from '../server/app.ts';
import { testConfig } from '../server/config.ts';
import { createDb } from '../server/db/knex.ts';
import { migrateLatest } from '../server/db/migrate.ts';
import { SYSTEM_ACTOR } from '../server/domain/audit/actor.ts';
import type { AuthContext } from '../server/domain/auth/auth-context.ts';
import { ROLE_SCOPES } from '../server/domain/auth/scopes.ts';
import { pushSamples } from '../server/domain/samples/samples.service.ts';
import { startDeliveryWorker } from '../server/domain/webhooks/delivery-worker.ts';
import { createEndpoint } from '../server/domain/webhooks/webhooks.service.ts';
import { createLogger } from '../server/logger.ts';
import { seedDemoLab } from '../server/seed/demo-lab.ts';

const EVENTS = Number(process.env.BENCH_EVENTS ?? 1000);
const BATCH = 10;
const PORTS = [4321, 4322, 4323];

const quantile = (xs: number[], q: number) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * q))];

const received: { sampleId: string; at: number }[] = [];
function receiver(port: number): Promise<Server> {
  const server = createServer((req, res) => {
    let body = '';
    req.on('data', (chunk: Buffer) => (body += chunk));
    req.on('end', () => {
      received.push({ sampleId: (JSON.parse(body) as { data: { id: string } }).data.id, at: performance.now() });
      res.writeHead(204).end();
    });
  });
  return new Promise((resolve) => server.listen(port, '127.0.0.1', () => resolve(server)));
}

const dir = mkdtempSync('/tmp/wt-events-bench-');
const config = testConfig({ databaseFile: join(dir, 'bench.db'), webhookAllowPrivate: true });
const db = createDb(config);
await migrateLatest(db);
const lab = await seedDemoLab(db);
const app = createApp({ db, config, logger: createLogger('silent'), consoleDir: '/nonexistent' });
const ctx = app.locals.ctx;
const auth: AuthContext = {
  kind: 'session',
  userId: 'usr_bench',
  email: 'bench@kestrelbend.test',
  role: 'admin',
  scopes: ROLE_SCOPES.admin,
  label: SYSTEM_ACTOR.label,
};
const servers = await Promise.all(PORTS.map(receiver));
for (const port of PORTS)
  await createEndpoint(ctx, auth, { url: `http://127.0.0.1:${port}/hooks`, event_types: ['sample.created'], enabled: true });
const worker = startDeliveryWorker(ctx);

const committedAt = new Map<string, number>();
const started = performance.now();
for (let i = 0; i < EVENTS; i += BATCH) {
  const samples = Array.from({ length: Math.min(BATCH, EVENTS - i) }, (_, j) => ({
    sample_code: `K24-B${String(i + j).padStart(4, '0')}-F1`,
    instrument_id: lab.foundry.id,
    method_id: lab.feMethod.id,
    burns: [{ values: { C: 0.45, Mn: 0.75, Si: 0.25 } }, { values: { C: 0.44, Mn: 0.76, Si: 0.24 } }],
  }));
  const stored = await pushSamples(ctx, auth, samples, true);
  const now = performance.now();
  for (const { id } of stored) committedAt.set(id, now);
  // As a server between requests: let the worker's I/O run, so that commit → receipt measures
  // the worker rather than a loop of pushes that never lets go of the event loop.
  await new Promise((resolve) => setImmediate(resolve));
}
const pushed = performance.now() - started;
const deadline = Date.now() + 120_000;
while (received.length < EVENTS * PORTS.length && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 5));
const total = performance.now() - started;

const latencies = received.map((r) => r.at - committedAt.get(r.sampleId)!);
console.log(`webhooks: ${EVENTS} events × ${PORTS.length} receivers = ${received.length} of ${EVENTS * PORTS.length} delivered`);
console.log(
  `  pushes committed in ${(pushed / 1000).toFixed(2)} s; everything delivered ${(total / 1000).toFixed(2)} s after the first push`,
);
console.log(`  commit → receipt: median ${quantile(latencies, 0.5).toFixed(0)} ms, p99 ${quantile(latencies, 0.99).toFixed(0)} ms`);

await worker.stop();
await Promise.all(servers.map((s) => new Promise((resolve) => s.close(resolve))));
ctx.mailer.close();
await db.destroy();
rmSync(dir, { recursive: true, force: true });
