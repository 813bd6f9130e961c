// Meltwire as its own process (what `npm start` runs) on a SQLite file or, given DATABASE_URL in
// `env`, on PostgreSQL: for tests that kill it or run several nodes, and for the benches.
import { type ChildProcess, spawn } from 'node:child_process';
import { resolve } from 'node:path';
import { DEMO_PASSWORD, DEMO_USERS } from '../../server/seed/demo-users.ts';

const ROOT = resolve(import.meta.dirname, '../..');

export interface ServerProcess {
  url: string;
  child: ChildProcess;
  /** Everything the process printed so far (stdout and stderr). */
  output(): string;
  /** kill -9: no shutdown, no flush, no transaction finished. */
  kill(): Promise<void>;
  stop(): Promise<void>;
}

export async function startServerProcess(databaseFile: string, port: number, env: Record<string, string> = {}): Promise<ServerProcess> {
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
      ...env,
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
    output: () => output,
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

/** Signs in as the demo administrator; returns the session cookie. */
export async function signIn(url: string): Promise<string> {
  const res = await fetch(`${url}/api/v1/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: DEMO_USERS[0].email, password: DEMO_PASSWORD }),
  });
  return res.headers.get('set-cookie')!.split(';')[0];
}
