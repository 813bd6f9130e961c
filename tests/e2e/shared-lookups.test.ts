// The Drift page and the upload form pick instruments from one shared list. They once loaded it
// under the same cache key with different fetchers (the first 200 against every page), so
// whichever page opened first decided what the other showed. With more than 200 instruments,
// both pages list every one of them whichever is opened first.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';

const ADMIN = 'admin@kestrelbend.test';
const EXTRA = 205;

let session: Awaited<ReturnType<typeof consoleSession>>;
let page: Page;
let total: number;

beforeAll(async () => {
  session = await consoleSession(ADMIN);
  page = session.page;
  for (let i = 0; i < EXTRA; i += 1) {
    const code = `ZZ-${String(i).padStart(3, '0')}`;
    const res = await page.request.post(`${session.server.url}/api/v1/instruments`, {
      data: { code, name: `Stand ${code}`, site: 'Test bay' },
      headers: { Origin: session.server.url },
    });
    expect(res.status()).toBe(201);
  }
  const listed = await page.request.get(`${session.server.url}/api/v1/instruments?limit=200`);
  expect((await listed.json()).next_cursor).not.toBeNull(); // more than one page: the case that clashed
  total = EXTRA + (await countDemoInstruments());
  // The Overview read the instrument list at sign-in, before the extra ones existed: start afresh.
  await page.reload();
  await page.getByRole('heading', { name: /^Welcome, / }).waitFor();
});
afterAll(() => session?.close());

async function countDemoInstruments(): Promise<number> {
  let count = 0;
  let cursor: string | null = null;
  do {
    const url = `${session.server.url}/api/v1/instruments?limit=200${cursor ? `&cursor=${cursor}` : ''}`;
    const body = (await (await page.request.get(url)).json()) as { data: { code: string }[]; next_cursor: string | null };
    count += body.data.filter((instrument) => !instrument.code.startsWith('ZZ-')).length;
    cursor = body.next_cursor;
  } while (cursor);
  return count;
}

const nav = () => page.getByRole('navigation', { name: 'Main' });

/** Opens a page through the main navigation (the query cache survives) and waits until it is there. */
async function openByNav(label: string, path: string): Promise<void> {
  await nav().getByRole('link', { name: label, exact: true }).click();
  await page.waitForURL((url) => url.pathname === path);
}

/** The page's Instrument select offers every instrument (ZZ-204, the last, is on the second API page). */
async function expectEveryInstrument(): Promise<void> {
  const choices = page.getByLabel('Instrument', { exact: true }).locator('option:not([value=""])');
  await expect.poll(() => choices.count(), { timeout: 15_000 }).toBe(total);
}

describe('shared instrument list', () => {
  it('shows every instrument on the upload form after the Drift page loaded the list first', async () => {
    await openByNav('Drift', '/drift');
    await expectEveryInstrument();
    await openByNav('Upload results', '/imports/new');
    await expectEveryInstrument();
  });

  it('shows every instrument on the Drift page after the upload form loaded the list first', async () => {
    await page.goto(`${session.server.url}/imports/new`); // a fresh load: an empty cache
    await expectEveryInstrument();
    await openByNav('Drift', '/drift');
    await expectEveryInstrument();
  });
});
