// The Overview page's "Instrument feeds" card: the agent (agent/) delivers a file from a real
// folder and reports, and the console shows the feed alive with its last file; a feed whose agent
// fell silent shows as stale, an instrument without an agent as such.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';
import { issueLiveKey, resultFile, startAgent } from '../agent/agent-harness.ts';

let session: Awaited<ReturnType<typeof consoleSession>>;
let page: Page;
let dir: string;
let foundryId: string;

beforeAll(async () => {
  session = await consoleSession('omar.reyes@kestrelbend.test');
  page = session.page;
  dir = mkdtempSync(join(tmpdir(), 'meltwire-feed-e2e-'));
  mkdirSync(join(dir, 'results'));
  foundryId = (await session.server.db('instruments').where({ code: 'OES-1' }).first()).id;
  const methodId = (await session.server.db('methods').where({ code: 'FE-LA' }).first()).id;
  writeFileSync(
    join(dir, 'agent.json'),
    JSON.stringify({
      server_url: session.server.url,
      api_key: await issueLiveKey(session.server, ['imports:write']),
      instrument_id: foundryId,
      method_id: methodId,
      folders: ['results'],
      stable_seconds: 0.5,
      ledger_file: 'ledger.jsonl',
      log_file: 'agent.log',
    }),
  );
});
afterAll(async () => {
  await session?.close();
  rmSync(dir, { recursive: true, force: true });
});

const card = () => page.getByRole('list', { name: 'Instrument feeds' });

describe('Instrument feeds on the Overview page', () => {
  it('shows the feed alive with the last file once the agent delivered it', async () => {
    writeFileSync(join(dir, 'results', 'K24-0990.csv'), resultFile('K24-0990-F1'));
    const run = startAgent(['--config', join(dir, 'agent.json'), '--once']);
    expect((await run.exited).code).toBe(0);
    await page.reload();
    const foundry = card().getByTestId('feed-OES-1');
    await expect.poll(() => foundry.textContent(), { timeout: 15_000 }).toContain('feed alive');
    const text = await foundry.textContent();
    expect(text).toContain('nothing waiting');
    expect(text).toContain('K24-0990.csv at');
    expect(text).toContain('agent 0.1.0');
    expect(await card().getByTestId('feed-OES-2').textContent()).toContain('no agent');
  });

  it('shows a feed as stale once its agent has been silent too long', async () => {
    await session.server
      .db('instrument_feeds')
      .where({ instrument_id: foundryId })
      .update({ reported_at: new Date(Date.now() - 60 * 60_000).toISOString() });
    await page.reload();
    const foundry = card().getByTestId('feed-OES-1');
    await expect.poll(() => foundry.textContent(), { timeout: 15_000 }).toContain('stale');
    expect(await foundry.textContent()).toContain('silent for more than 15 minutes');
  });
});
