// The agent against a real server and a real folder: complete files only, exactly once through a
// server outage and through kill -9 between upload and ledger, refused files set aside.
import { createHash } from 'node:crypto';
import { appendFileSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { CRASH_AFTER_UPLOAD_ENV } from '../../agent/agent.ts';
import { type Bench, resultFile, startAgent, startBench, waitFor } from './agent-harness.ts';

const sha256 = (text: string | Buffer) => createHash('sha256').update(text).digest('hex');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

let bench: Bench;
beforeEach(async () => {
  bench = await startBench(4501);
});
afterEach(() => bench.close());

describe('meltwire-agent delivering a folder', () => {
  it('sends a file written slowly in chunks once, and only when it is complete', async () => {
    bench.writeConfig({ stable_seconds: 2 });
    const agent = startAgent(['--config', bench.configFile]);
    const path = join(bench.folder, 'K24-0901.csv');
    const burns = Array.from({ length: 7 }, (_, i) => `K24-0901-F1,K24-0901,${i + 1},0.7${i},0.45${i}`);
    const lines = ['Sample,Heat,Burn,Mn %,C %', ...burns];
    // 4 s of writing, one line every 0.5 s: twice stable_seconds (2 s) altogether, yet never
    // paused long enough for the agent to take it (a quarter of the stable time between writes).
    writeFileSync(path, '');
    for (const line of lines) {
      appendFileSync(path, `${line}\n`);
      await sleep(500);
      expect(await bench.imports()).toEqual([]);
    }
    const [entry] = await waitFor('the ledger line', () => (bench.ledger().length > 0 ? bench.ledger() : undefined));
    await sleep(1500); // more passes: nothing more is sent
    const imports = await bench.imports();
    expect(imports).toHaveLength(1);
    expect(imports[0]).toMatchObject({ file_name: 'K24-0901.csv', sha256: sha256(readFileSync(path)) });
    expect(bench.ledger()).toEqual([
      expect.objectContaining({
        path,
        outcome: 'sent',
        import_id: imports[0].id,
        sha256: imports[0].sha256,
        size: readFileSync(path).length,
      }),
    ]);
    expect(entry.import_id).toBe(imports[0].id);
    const [{ n: burnsStored }] = await bench.server
      .db('burns')
      .join('samples', 'burns.sample_id', 'samples.id')
      .where('samples.import_id', imports[0].id)
      .count({ n: '*' });
    expect(Number(burnsStored)).toBe(burns.length); // every line written, none cut off
    expect(existsSync(path)).toBe(true); // nothing is deleted unless configured
    expect(await agent.stop()).toEqual({ code: 0, signal: null });
  });

  it('queues files while the server is down and delivers each exactly once after it returns', async () => {
    const agent = startAgent(['--config', bench.configFile]);
    writeFileSync(join(bench.folder, 'before.csv'), resultFile('K24-0910-F1'));
    await waitFor('the first delivery', () => bench.ledger().length === 1);
    await bench.stopServer();
    const names = ['a.csv', 'b.csv', 'c.csv', 'd.csv', 'e.csv'];
    names.forEach((name, i) => writeFileSync(join(bench.folder, name), resultFile(`K24-092${i}-F1`)));
    await sleep(3000); // several retries against a closed port, with backoff
    expect(bench.ledger()).toHaveLength(1);
    await bench.startServer();
    await waitFor('every file in the ledger', () => bench.ledger().length === 1 + names.length);
    await sleep(1000);
    const imports = await bench.imports();
    expect(imports).toHaveLength(1 + names.length);
    expect(new Set(imports.map((i) => i.sha256)).size).toBe(imports.length);
    expect(imports.map((i) => i.file_name).sort()).toEqual(['before.csv', ...names].sort());
    const log = readFileSync(join(bench.dir, 'logs/agent.log'), 'utf8');
    expect(log).toContain('delivery failed: files kept, retrying');
    expect(log).toMatch(/server unreachable/);
    // The heartbeat after recovery: nothing waits, the error is cleared.
    const feed = await waitFor('a heartbeat with an empty queue', async () => {
      const body = await bench.feed();
      return body.queue_length === 0 && body.last_error === null ? body : undefined;
    });
    expect(feed).toMatchObject({ state: 'alive', agent: { version: '0.1.0' }, last_file: { name: expect.stringMatching(/\.csv$/) } });
    await agent.stop();
  });

  it('after kill -9 between upload and ledger write, a restart sends the file again without a duplicate import', async () => {
    const path = join(bench.folder, 'K24-0930.csv');
    writeFileSync(path, resultFile('K24-0930-F1'));
    const crashed = await startAgent(['--config', bench.configFile, '--once'], { env: { [CRASH_AFTER_UPLOAD_ENV]: '1' } }).exited;
    expect(crashed).toEqual({ code: null, signal: 'SIGKILL' });
    expect(bench.ledger()).toEqual([]);
    expect(existsSync(`${bench.ledgerFile}.lock`)).toBe(true); // left behind by the dead process: taken over
    const [first] = await bench.imports();
    expect(first.file_name).toBe('K24-0930.csv');
    const again = startAgent(['--config', bench.configFile, '--once']);
    expect((await again.exited).code).toBe(0);
    expect(await bench.imports()).toEqual([first]);
    expect(bench.ledger()).toEqual([expect.objectContaining({ path, outcome: 'sent', import_id: first.id })]);
    expect(readFileSync(join(bench.dir, 'logs/agent.log'), 'utf8')).toMatch(/"msg":"file delivered".*"replayed":true/);
  });

  it('moves a broken file to rejected/ with its problem, delivers the rest, and reports the error', async () => {
    const broken = 'Sample,Heat,Burn,Mn %,C %\nK24-0940-F1,K24-0940,1,0.75,0.452\nK24-0940-F1,K24-0940,2,0.7.6,0.448\n';
    writeFileSync(join(bench.folder, 'broken.csv'), broken);
    writeFileSync(join(bench.folder, 'good.csv'), resultFile('K24-0941-F1'));
    const run = startAgent(['--config', bench.configFile, '--once']);
    expect((await run.exited).code).toBe(0);
    expect(existsSync(join(bench.folder, 'broken.csv'))).toBe(false);
    expect(readFileSync(join(bench.folder, 'rejected/broken.csv'), 'utf8')).toBe(broken);
    const note = JSON.parse(readFileSync(join(bench.folder, 'rejected/broken.csv.problem.json'), 'utf8'));
    expect(note).toMatchObject({
      file: 'broken.csv',
      sha256: sha256(broken),
      status: 422,
      problem: { status: 422, type: expect.any(String) },
    });
    expect(note.problem.errors[0].location).toBe('file:line 3:Mn %');
    expect((await bench.imports()).map((i) => i.file_name)).toEqual(['good.csv']);
    expect(
      bench
        .ledger()
        .map((e) => e.outcome)
        .sort(),
    ).toEqual(['rejected', 'sent']);
    const feed = await bench.feed();
    expect(feed).toMatchObject({
      state: 'alive',
      queue_length: 0,
      last_error: { message: expect.stringContaining('broken.csv refused: 422') },
    });
  });

  it.each([
    // The heartbeat reports the error when the key itself is accepted.
    ['an unknown method (422)', { method_id: 'mth_does_not_exist' }, 'mth_does_not_exist'],
    ['a refused key (401)', { api_key: 'mw_live_not_a_real_key' }, null],
  ])('keeps every file in place while the server refuses the agent’s own settings: %s', async (_case, settings, reported) => {
    bench.writeConfig(settings);
    writeFileSync(join(bench.folder, 'kept.csv'), resultFile('K24-0950-F1'));
    const run = startAgent(['--config', bench.configFile, '--once']);
    expect((await run.exited).code).toBe(2);
    expect(existsSync(join(bench.folder, 'kept.csv'))).toBe(true);
    expect(existsSync(join(bench.folder, 'rejected'))).toBe(false);
    expect(bench.ledger()).toEqual([]);
    expect(readFileSync(join(bench.dir, 'logs/agent.log'), 'utf8')).toContain(
      'the server refuses the agent’s settings: files kept, retrying',
    );
    if (reported) expect(await bench.feed()).toMatchObject({ queue_length: 1, last_error: { message: expect.stringContaining(reported) } });
  });

  it('delivers the kept files once the refused setting is corrected', async () => {
    bench.writeConfig({ method_id: 'mth_does_not_exist' });
    writeFileSync(join(bench.folder, 'waiting.csv'), resultFile('K24-0955-F1'));
    expect((await startAgent(['--config', bench.configFile, '--once']).exited).code).toBe(2);
    bench.writeConfig();
    expect((await startAgent(['--config', bench.configFile, '--once']).exited).code).toBe(0);
    expect((await bench.imports()).map((i) => i.file_name)).toEqual(['waiting.csv']);
    expect(existsSync(join(bench.folder, 'rejected'))).toBe(false);
  });

  it('sends a changed file again as a new import, and skips a copy of bytes already sent', async () => {
    const path = join(bench.folder, 'K24-0960.csv');
    writeFileSync(path, resultFile('K24-0960-F1'));
    expect((await startAgent(['--config', bench.configFile, '--once']).exited).code).toBe(0);
    writeFileSync(path, resultFile('K24-0961-F1'));
    writeFileSync(join(bench.folder, 'copy.csv'), resultFile('K24-0960-F1'));
    expect((await startAgent(['--config', bench.configFile, '--once']).exited).code).toBe(0);
    expect(await bench.imports()).toHaveLength(2);
    expect(bench.ledger().map((e) => [e.path.split('/').pop(), e.outcome])).toEqual(
      expect.arrayContaining([
        ['K24-0960.csv', 'sent'],
        ['K24-0960.csv', 'changed-resent'],
        ['copy.csv', 'duplicate'],
      ]),
    );
  });

  it('refuses to run beside another agent on the same ledger', async () => {
    const first = startAgent(['--config', bench.configFile]);
    await waitFor('the first agent’s lock', () => existsSync(`${bench.ledgerFile}.lock`));
    const second = startAgent(['--config', bench.configFile, '--once']);
    expect((await second.exited).code).toBe(75);
    expect(second.output()).toContain(`another agent (process ${first.child.pid}) is running`);
    await first.stop();
    expect(existsSync(`${bench.ledgerFile}.lock`)).toBe(false);
  });

  it('shows what would be sent with --dry-run, and sends nothing', async () => {
    writeFileSync(join(bench.folder, 'K24-0970.csv'), resultFile('K24-0970-F1'));
    writeFileSync(join(bench.folder, '~K24-0971.csv'), 'lock');
    writeFileSync(join(bench.folder, '.hidden.csv'), 'hidden');
    writeFileSync(join(bench.folder, 'K24-0972.csv.tmp'), 'partial');
    const run = startAgent(['--config', bench.configFile, '--dry-run']);
    expect((await run.exited).code).toBe(0);
    const lines = run
      .output()
      .split('\n')
      .filter((l) => l.startsWith('would send'));
    expect(lines).toEqual([expect.stringContaining('K24-0970.csv (')]);
    expect(await bench.imports()).toEqual([]);
    expect(bench.ledger()).toEqual([]);
  });
});
