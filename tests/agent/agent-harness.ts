// A real Meltwire (tests/helpers/live-server.ts) on a SQLite file that survives restarts, a real
// temporary results folder, and the agent as its own process (so it can be killed with -9).
import { type ChildProcess, spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { createApiKey } from '../../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../../server/domain/auth/auth.service.ts';
import type { Scope } from '../../server/domain/auth/scopes.ts';
import type { LedgerEntry } from '../../agent/ledger.ts';
import type { InstrumentFeedSchema } from '../../server/domain/feeds/feeds.schemas.ts';
import type { z } from '../../server/lib/zod.ts';
import { createUser } from '../helpers/test-app.ts';
import { startLiveServer } from '../helpers/live-server.ts';

export const ROOT = resolve(import.meta.dirname, '../..');

export type Server = Awaited<ReturnType<typeof startLiveServer>>;
export type InstrumentFeed = z.output<typeof InstrumentFeedSchema>;

export interface Bench {
  dir: string;
  folder: string;
  databaseFile: string;
  configFile: string;
  ledgerFile: string;
  server: Server;
  url: string;
  key: string;
  instrumentId: string;
  methodId: string;
  /** Stops the server, keeping its database file; start() brings it back on the same port. */
  stopServer(): Promise<void>;
  startServer(): Promise<void>;
  writeConfig(overrides?: Record<string, unknown>): void;
  imports(): Promise<{ id: string; sha256: string; file_name: string }[]>;
  ledger(): LedgerEntry[];
  /** The instrument's feed as a reader (the console, a plant screen) sees it. */
  feed(): Promise<InstrumentFeed>;
  close(): Promise<void>;
}

export async function issueLiveKey(server: Server, scopes: Scope[]): Promise<string> {
  const owner = await createUser(server.db, 'admin');
  const key = await createApiKey(server.ctx, sessionAuthContext(owner, 'test'), { name: `agent ${owner.email}`, scopes });
  return key.secret;
}

/** Fast timings so a test sees minutes of agent life in seconds. */
const FAST = { stable_seconds: 1, poll_seconds: 0.2, heartbeat_seconds: 0.5, retry_base_seconds: 0.2, retry_max_seconds: 1 };

export async function startBench(port: number): Promise<Bench> {
  const dir = mkdtempSync(join(tmpdir(), 'meltwire-agent-'));
  const folder = join(dir, 'results');
  mkdirSync(folder);
  const databaseFile = join(dir, 'meltwire.db');
  let server = await startLiveServer({ console: false, databaseFile, port });
  const key = await issueLiveKey(server, ['imports:write']);
  const instrumentId = (await server.db('instruments').where({ code: 'OES-1' }).first()).id as string;
  const methodId = (await server.db('methods').where({ code: 'FE-LA' }).first()).id as string;
  const bench: Bench = {
    dir,
    folder,
    databaseFile,
    configFile: join(dir, 'agent.json'),
    ledgerFile: join(dir, 'ledger.jsonl'),
    get server() {
      return server;
    },
    url: `http://localhost:${port}`,
    key,
    instrumentId,
    methodId,
    stopServer: () => server.stop(),
    async startServer() {
      server = await startLiveServer({ console: false, databaseFile, port });
    },
    writeConfig(overrides = {}) {
      const config = {
        server_url: bench.url,
        api_key: key,
        instrument_id: instrumentId,
        method_id: methodId,
        folders: ['results'],
        ledger_file: 'ledger.jsonl',
        log_file: 'logs/agent.log',
        ...FAST,
        ...overrides,
      };
      writeFileSync(bench.configFile, JSON.stringify(config, null, 2));
    },
    imports: () => server.db('imports').select('id', 'sha256', 'file_name').orderBy('created_at'),
    ledger: () =>
      existsSync(bench.ledgerFile)
        ? readFileSync(bench.ledgerFile, 'utf8')
            .split('\n')
            .filter(Boolean)
            .map((line) => JSON.parse(line) as LedgerEntry)
        : [],
    async feed() {
      const headers = { authorization: `Bearer ${await issueLiveKey(server, ['samples:read'])}` };
      return (await fetch(`${bench.url}/api/v1/instruments/${instrumentId}/feed`, { headers })).json() as Promise<InstrumentFeed>;
    },
    async close() {
      await server.stop().catch(() => undefined);
      rmSync(dir, { recursive: true, force: true });
    },
  };
  bench.writeConfig();
  return bench;
}

export interface AgentProcess {
  child: ChildProcess;
  output(): string;
  /** Resolves with the exit code, or the signal that ended the process. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  stop(): Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/** The agent as `npm run agent` runs it (tsx), or any other command line (the single-file build). */
export function startAgent(args: string[], options: { env?: Record<string, string>; command?: string[]; cwd?: string } = {}): AgentProcess {
  const command = options.command ?? [process.execPath, '--import', 'tsx', join(ROOT, 'agent/main.ts')];
  const child = spawn(command[0], [...command.slice(1), ...args], {
    cwd: options.cwd ?? ROOT,
    env: { ...process.env, MELTWIRE_AGENT_KEY: '', ...options.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += String(chunk)));
  child.stderr!.on('data', (chunk) => (output += String(chunk)));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((done) =>
    child.once('exit', (code, signal) => done({ code, signal })),
  );
  return {
    child,
    output: () => output,
    exited,
    stop() {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
      return exited;
    },
  };
}

export async function waitFor<T>(what: string, probe: () => T | Promise<T>, timeoutMs = 20_000): Promise<NonNullable<T>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value as NonNullable<T>;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A small valid wide result file: one sample with two burns (invented values). */
export function resultFile(sampleCode: string): string {
  return `Sample,Heat,Burn,Mn %,C %\n${sampleCode},K24-0900,1,0.75,0.452\n${sampleCode},K24-0900,2,0.76,0.448\n`;
}
