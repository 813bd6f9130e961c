// The single-file build (`npm run agent:build`) runs with plain Node and nothing beside it: no
// node_modules, no TypeScript loader — what is copied to an instrument PC.
import { execFileSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Bench, resultFile, ROOT, startAgent, startBench } from './agent-harness.ts';

let bench: Bench;
let buildDir: string;
beforeAll(async () => {
  bench = await startBench(4502);
  buildDir = mkdtempSync(join(tmpdir(), 'meltwire-agent-build-'));
});
afterAll(async () => {
  await bench.close();
  rmSync(buildDir, { recursive: true, force: true });
});

describe('the single-file agent build', () => {
  it('builds with the package script’s settings and delivers a file with `node meltwire-agent.cjs --once`', async () => {
    const script = (JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { scripts: Record<string, string> }).scripts[
      'agent:build'
    ];
    const [command, ...args] = script.split(' ');
    expect(command).toBe('esbuild');
    const built = join(buildDir, 'built.cjs');
    const esbuildArgs = args.map((arg) => (arg.startsWith('--outfile=') ? `--outfile=${built}` : arg));
    execFileSync(join(ROOT, 'node_modules/.bin/esbuild'), esbuildArgs, { cwd: ROOT, stdio: 'pipe' });
    // Alone in a folder of its own, far from the repository's node_modules.
    const runDir = mkdtempSync(join(buildDir, 'pc-'));
    copyFileSync(built, join(runDir, 'meltwire-agent.cjs'));
    writeFileSync(join(bench.folder, 'K24-0980.csv'), resultFile('K24-0980-F1'));
    writeFileSync(join(runDir, 'agent.key'), `${bench.key}\n`);
    bench.writeConfig({ api_key: undefined, api_key_file: join(runDir, 'agent.key') });
    const run = startAgent(['--config', bench.configFile, '--once'], {
      command: [process.execPath, join(runDir, 'meltwire-agent.cjs')],
      cwd: runDir,
    });
    expect((await run.exited).code).toBe(0);
    const imports = await bench.imports();
    expect(imports.map((i) => i.file_name)).toEqual(['K24-0980.csv']);
    expect(bench.ledger()).toEqual([expect.objectContaining({ outcome: 'sent', import_id: imports[0].id })]);
    expect(readFileSync(join(bench.dir, 'logs/agent.log'), 'utf8')).toContain('"key_source":"api_key_file"');
  });

  it('stops at start with a message naming the wrong field', async () => {
    bench.writeConfig({ poll_seconds: -1, surprise: true });
    const run = startAgent(['--config', bench.configFile, '--once']);
    expect((await run.exited).code).toBe(78);
    expect(run.output()).toContain('poll_seconds');
    expect(run.output()).toContain('surprise');
  });
});
