// Meltwire as its own process (what `npm start` runs) on a SQLite file, for tests that kill it.
import { type ChildProcess, spawn } from 'node:child_process';
import { resolve } from 'node:path';

const ROOT = resolve(import.meta.dirname, '../../..');

export interface ServerProcess {
  url: string;
  child: ChildProcess;
  /** kill -9: no shutdown, no flush, no transaction finished. */
  kill(): Promise<void>;
  stop(): Promise<void>;
}

export async function startServerProcess(databaseFile: string, port: number): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/start.ts', '--dev'], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'development',
      PORT: String(port),
      DATABASE_FILE: databaseFile,
      DATABASE_URL: '',
      LOG_LEVEL: 'warn',
      LOGIN_RATE_LIMIT_PER_MINUTE: '1000',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (chunk) => (output += String(chunk)));
  child.stderr!.on('data', (chunk) => (output += String(chunk)));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the server exited with ${child.exitCode}:\n${output}`);
    try {
      if ((await fetch(`${url}/api/v1/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`the server did not start:\n${output}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  const exited = new Promise<void>((done) => child.once('exit', () => done()));
  return {
    url,
    child,
    async kill() {
      child.kill('SIGKILL');
      await exited;
    },
    async stop() {
      child.kill('SIGTERM');
      await exited;
    },
  };
}
