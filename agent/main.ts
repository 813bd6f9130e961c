// meltwire-agent: delivers the result files an instrument's software writes to a folder to
// Meltwire, exactly once, through outages. `--config agent.json` (required), `--once` for one
// pass (schedulers), `--dry-run` to list what would be sent without sending or recording it.
import { parseArgs } from 'node:util';
import { Agent, CRASH_AFTER_UPLOAD_ENV } from './agent.ts';
import { type AgentConfig, ConfigError, loadAgentConfig } from './config.ts';
import { sendHeartbeat } from './heartbeat.ts';
import { Ledger } from './ledger.ts';
import { type AgentLog, createAgentLog, errorMessage } from './log.ts';
import { lockLedger } from './single-instance.ts';

const USAGE = `usage: meltwire-agent --config agent.json [--once] [--dry-run]
  --once     one pass: deliver the files that are complete now, report, exit
             (exit code 0 when nothing waits, 2 when files remain queued,
             75 when another agent runs on the same ledger, 78 for a bad configuration)
  --dry-run  show what would be sent; sends and records nothing (implies --once)`;

/** Exit code of --once when files remain queued (server down, files still being written). */
const EXIT_QUEUED = 2;
/** A change in the queue, the last delivery or the last error is reported at most this often. */
const CHANGE_REPORT_MS = 5_000;
/** Another agent runs on the same ledger (sysexits EX_TEMPFAIL: try again later). */
const EXIT_LOCKED = 75;

const sleep = (ms: number, signal: AbortSignal) =>
  new Promise<void>((done) => {
    if (signal.aborted) return done();
    const timer = setTimeout(done, ms);
    signal.addEventListener('abort', () => (clearTimeout(timer), done()), { once: true });
  });

async function heartbeat(config: AgentConfig, agent: Agent, log: AgentLog): Promise<void> {
  try {
    await sendHeartbeat(config, agent.status());
  } catch (error) {
    log.warn('heartbeat failed', { error: errorMessage(error) });
  }
}

async function runOnce(config: AgentConfig, agent: Agent, log: AgentLog, dryRun: boolean): Promise<number> {
  await agent.pass();
  // Files seen for the first time are stable only after stable_seconds: look again then.
  const settle = agent.msUntilSettled();
  if (settle > 0) await sleep(settle + 50, new AbortController().signal);
  const waiting = await agent.pass();
  if (!dryRun) await heartbeat(config, agent, log);
  log.info('pass finished', { waiting });
  return waiting > 0 ? EXIT_QUEUED : 0;
}

async function runForever(config: AgentConfig, agent: Agent, log: AgentLog): Promise<number> {
  const stop = new AbortController();
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      log.info('stopping', { signal });
      stop.abort();
    });
  }
  let lastHeartbeat = 0;
  let reported = '';
  while (!stop.signal.aborted) {
    try {
      await agent.pass();
    } catch (error) {
      log.error('pass failed', { error: errorMessage(error) });
    }
    // Every heartbeat_seconds, and sooner (at most every CHANGE_REPORT_MS) when what people see changed.
    const status = agent.status();
    const seen = JSON.stringify([status.queueLength, status.lastSuccessAt, status.lastError?.message]);
    const since = Date.now() - lastHeartbeat;
    if (
      since >= config.heartbeat_seconds * 1000 ||
      (seen !== reported && since >= Math.min(CHANGE_REPORT_MS, config.heartbeat_seconds * 1000))
    ) {
      await heartbeat(config, agent, log);
      lastHeartbeat = Date.now();
      reported = seen;
    }
    await sleep(config.poll_seconds * 1000, stop.signal);
  }
  await heartbeat(config, agent, log);
  return 0;
}

export async function main(argv: string[]): Promise<number> {
  let args;
  try {
    args = parseArgs({
      args: argv,
      options: { config: { type: 'string' }, once: { type: 'boolean' }, 'dry-run': { type: 'boolean' }, help: { type: 'boolean' } },
    });
  } catch (error) {
    process.stderr.write(`${errorMessage(error)}\n${USAGE}\n`);
    return 64;
  }
  if (args.values.help) return (process.stdout.write(`${USAGE}\n`), 0);
  if (!args.values.config) return (process.stderr.write(`--config is required\n${USAGE}\n`), 64);
  let config: AgentConfig;
  try {
    config = loadAgentConfig(args.values.config);
  } catch (error) {
    if (!(error instanceof ConfigError)) throw error;
    process.stderr.write(`meltwire-agent: ${error.message}\n`);
    return 78;
  }
  const dryRun = args.values['dry-run'] ?? false;
  const lock = dryRun ? undefined : lockLedger(config.ledger_file);
  if (lock && 'heldBy' in lock) {
    process.stderr.write(`meltwire-agent: another agent (process ${lock.heldBy}) is running on ${config.ledger_file}\n`);
    return EXIT_LOCKED;
  }
  const log = createAgentLog(dryRun ? undefined : config.log_file, { stderr: dryRun });
  const ledger = Ledger.open(config.ledger_file);
  const agent = new Agent(config, ledger, log, {
    dryRun,
    print: (line) => process.stdout.write(`${line}\n`),
    crashAfterUpload: process.env[CRASH_AFTER_UPLOAD_ENV] === '1',
  });
  log.info('agent started', {
    server_url: config.server_url,
    instrument_id: config.instrument_id,
    folders: config.folders,
    key_source: config.keySource,
    mode: dryRun ? 'dry-run' : args.values.once ? 'once' : 'service',
  });
  try {
    return dryRun || args.values.once ? await runOnce(config, agent, log, dryRun) : await runForever(config, agent, log);
  } finally {
    await log.close();
    lock?.release();
  }
}

main(process.argv.slice(2)).then(
  (code) => (process.exitCode = code),
  (error: unknown) => {
    process.stderr.write(`meltwire-agent: ${errorMessage(error)}\n`);
    process.exitCode = 1;
  },
);
