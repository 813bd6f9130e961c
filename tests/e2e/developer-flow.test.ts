// A new integrator, as a new user would: signs in, issues a key with samples:read in the
// copy-once dialog, runs the Quick start's copied curl examples with it, finds the call in the
// Request log, reads it with its curl equivalent and replays it; then tries the API reference.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seed/demo-users.ts';
import { launchBrowser } from '../helpers/browser.ts';
import { startLiveServer } from '../helpers/live-server.ts';

const run = promisify(execFile);
const INTEGRATOR = 'mes-bridge@kestrelbend.test';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let page: Page;
let secret: string;

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const nav = (label: string) => page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true });

/** Runs a snippet copied from the page the way a user pastes it into a shell. */
async function runSnippet(testId: string): Promise<string> {
  const code = await page.getByTestId(testId).innerText();
  const { stdout } = await run('bash', ['-c', code], { env: { ...process.env, MELTWIRE_KEY: secret } });
  return stdout;
}

describe('integrator developer flow', () => {
  it('signs in and issues a samples:read key that is shown once', async () => {
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill(INTEGRATOR);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: /Welcome, MES bridge/ }).waitFor();

    await nav('API keys').click();
    await page.getByRole('button', { name: 'Issue a key' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill('MES melt shop');
    await dialog.getByRole('checkbox', { name: 'samples:read' }).check();
    await dialog.getByRole('button', { name: 'Issue key' }).click();
    secret = (await page.getByTestId('api-key-secret').innerText()).trim();
    expect(secret).toMatch(/^mw_live_[0-9A-Za-z]{38}$/);
    await page.getByRole('button', { name: 'I have stored it' }).click();
    await page.getByRole('cell', { name: 'MES melt shop' }).waitFor();
    expect(await page.content()).not.toContain(secret);
  });

  it("calls the API with the key, from the test and with the Quick start's copied curl commands", async () => {
    const res = await fetch(`${server.url}/api/v1/samples?heat=K24-0412`, {
      headers: { authorization: `Bearer ${secret}`, 'x-request-id': 'e2e-first-call' },
    });
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.data.map((s: { sample_code: string }) => s.sample_code)).toEqual(['K24-0412-F1', 'K24-0412-P1']);
    expect(body.next_cursor).toBeNull();

    await nav('Quick start').click();
    await page.getByRole('heading', { name: 'Quick start' }).waitFor();
    expect(JSON.parse(await runSnippet('quick-start-first-call'))).toMatchObject({
      auth: 'api_key',
      scopes: ['samples:read'],
      user: { email: INTEGRATOR },
    });
    const list = JSON.parse(await runSnippet('quick-start-list'));
    expect(list.data).toHaveLength(2);
    expect(list.next_cursor).toEqual(expect.any(String));
    expect(await runSnippet('quick-start-errors')).toMatch(/^HTTP\/1\.1 403 Forbidden[\s\S]*"required_scope":"users:read"/);
    // Every demo sample, one JSON line each (the demo seeds 26 heat and lot samples and 2 × 72 control points).
    expect((await runSnippet('quick-start-pages')).trim().split('\n')).toHaveLength(170);
  });

  it('finds the call in the Request log, with its curl equivalent, and replays it as the signed-in user', async () => {
    await nav('Request log').click();
    await page.getByRole('heading', { name: 'Request log' }).waitFor();
    await page.getByLabel('Path starts with').fill('/api/v1/samples');
    await page.getByRole('button', { name: 'Apply' }).click();
    const row = page.getByTestId('request-log-row').filter({ hasText: 'MES melt shop (mw_live_' }).last();
    await row.waitFor();
    expect(await row.innerText()).toMatch(/GET\s+\/api\/v1\/samples\S*\s[\s\S]*\b200\b/);

    await row.getByRole('button', { name: /^Details of GET \/api\/v1\/samples/ }).click();
    const drawer = page.getByRole('dialog');
    await drawer.getByRole('definition').filter({ hasText: 'e2e-first-call' }).waitFor();
    const curl = await drawer.getByTestId('curl-command').innerText();
    expect(curl).toContain(`curl -sS '${server.url}/api/v1/samples?heat=K24-0412'`);
    expect(curl).toContain('Authorization: Bearer $MELTWIRE_KEY');
    expect(await drawer.getByTestId('response-body').innerText()).toContain('"next_cursor": null');
    expect(await drawer.getByTestId('request-body').innerText()).toBe('(no body)');
    expect(await page.content()).not.toContain(secret);

    await drawer.getByRole('button', { name: 'Replay' }).click();
    const result = drawer.getByTestId('replay-result');
    await result.waitFor();
    expect(await result.innerText()).toContain('200');
    await result.getByRole('link', { name: 'Open the new entry' }).click();
    await drawer.getByText('Replay of').waitFor();
    expect(await drawer.innerText()).toContain(INTEGRATOR);
    const newId = new URL(page.url()).searchParams.get('entry');
    const stored = await server.db('request_log').where({ id: newId }).first();
    expect(stored).toMatchObject({ path: '/api/v1/samples', status: 200, caller_type: 'user', caller_label: INTEGRATOR });
    const original = await server.db('request_log').where({ id: stored.replay_of }).first();
    expect(original).toMatchObject({ request_id: 'e2e-first-call', caller_type: 'api_key' });

    await page.keyboard.press('Escape');
    await page.getByTestId('request-log-row').filter({ hasText: 'replay' }).first().waitFor();
  });

  it('themes the API reference and runs "Try it out" with the session', async () => {
    await nav('API reference').click();
    const reference = page.getByTestId('api-reference');
    const operation = reference.locator('#operations-Auth-getMe');
    await operation.waitFor();
    const fonts = await reference
      .locator('.opblock-summary-path')
      .first()
      .evaluate((el) => getComputedStyle(el).fontFamily);
    expect(fonts).toMatch(/^"?JetBrains Mono"?/);
    const getColour = await reference
      .locator('.opblock-get .opblock-summary-method')
      .first()
      .evaluate((el) => getComputedStyle(el).backgroundColor);
    expect(getColour).toBe('rgb(47, 125, 109)'); // --color-verdigris-600 #2f7d6d in src/index.css

    await operation.locator('.opblock-summary').click();
    await operation.getByRole('button', { name: 'Try it out' }).click();
    await operation.getByRole('button', { name: 'Execute' }).click();
    const response = operation.locator('.live-responses-table .response');
    await response.waitFor();
    expect(await response.locator('.response-col_status').innerText()).toContain('200');
    expect(await response.locator('.response-col_description').innerText()).toContain(INTEGRATOR);
  });
});
