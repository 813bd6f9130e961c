// The TypeScript quick start runs as written, against a live server seeded with the demo: in a
// fresh folder holding only examples/quick-start's files (node_modules linked in place of
// `npm install`), `npm run types` generates the types from the server, `npm run typecheck` checks
// the script against them, and `npx tsx quick-start.ts` prints exactly the sample output shown in
// examples/quick-start/README.md and on the console's Quick start page.
import { execFile } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApiKey } from '../../server/domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from '../../server/domain/auth/auth.service.ts';
import { findUserByEmail } from '../../server/domain/users/users.repository.ts';
import { startLiveServer } from '../helpers/live-server.ts';

const run = promisify(execFile);
const ROOT = resolve(import.meta.dirname, '../..');
const EXAMPLE = join(ROOT, 'examples/quick-start');
const INTEGRATOR = 'mes-bridge@kestrelbend.test';
let server: Awaited<ReturnType<typeof startLiveServer>>;
let folder: string;

beforeAll(async () => {
  server = await startLiveServer({ console: false });
  folder = mkdtempSync(join(tmpdir(), 'meltwire-quick-start-'));
  for (const file of ['package.json', 'tsconfig.json', 'quick-start.ts']) copyFileSync(join(EXAMPLE, file), join(folder, file));
  symlinkSync(join(ROOT, 'node_modules'), join(folder, 'node_modules'));
});
afterAll(async () => {
  await server?.stop();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

async function integratorKey(): Promise<string> {
  const user = await findUserByEmail(server.db, INTEGRATOR);
  const key = await createApiKey(server.ctx, sessionAuthContext(user!, 'quick-start-test'), {
    name: 'quick start',
    scopes: ['samples:read'],
  });
  return key.secret;
}

function inFolder(command: string, args: string[], env: Record<string, string> = {}) {
  return run(command, args, { cwd: folder, env: { ...process.env, MELTWIRE_URL: server.url, ...env } });
}

/** The fenced block that follows a heading's "You get" in the README. */
function readmeSampleOutput(): string {
  const readme = readFileSync(join(EXAMPLE, 'README.md'), 'utf8');
  const block = /You get:\n\n```text\n([\s\S]*?)```/.exec(readme);
  if (!block) throw new Error('examples/quick-start/README.md has no "You get:" text block');
  return block[1];
}

describe('examples/quick-start', () => {
  it('generates its types from the server and typechecks against them', async () => {
    await inFolder('npm', ['run', '--silent', 'types']);
    expect(readFileSync(join(folder, 'meltwire.d.ts'), 'utf8')).toContain('"/samples": {');
    await inFolder('npm', ['run', '--silent', 'typecheck']);
  }, 60_000);

  it('prints the sample output shown in the README and on the console', async () => {
    const { stdout, stderr } = await inFolder('npx', ['tsx', 'quick-start.ts'], { MELTWIRE_KEY: await integratorKey() });
    expect(stderr).toBe('');
    const shown = readFileSync(join(EXAMPLE, 'sample-output.txt'), 'utf8');
    expect(stdout).toBe(shown);
    expect(readmeSampleOutput()).toBe(shown);
  }, 60_000);

  it('says what to set when there is no key, and prints a problem with its request id', async () => {
    const noKey = await inFolder('npx', ['tsx', 'quick-start.ts'], { MELTWIRE_KEY: '' }).catch(
      (error: { code: number; stderr: string }) => error,
    );
    expect(noKey).toMatchObject({ code: 2, stderr: expect.stringContaining('Set MELTWIRE_KEY') });
    const wrong = await inFolder('npx', ['tsx', 'quick-start.ts'], { MELTWIRE_KEY: 'mw_live_notakey' }).catch(
      (error: { code: number; stderr: string }) => error,
    );
    expect(wrong).toMatchObject({ code: 1 });
    const [problem, requestLine] = (wrong as { stderr: string }).stderr.split('\n');
    expect(readFileSync(join(EXAMPLE, 'README.md'), 'utf8')).toContain(`\n${problem}\nrequest `);
    expect(requestLine).toMatch(/^request [0-9a-f-]{36}$/);
  }, 60_000);
});
