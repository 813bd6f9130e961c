// An integrator runs the quick start, at 1024 and 1440 px: issues a key (scopes grouped by
// resource), saves the TypeScript quick start from the page and runs it as written (npm install
// replaced by linking node_modules) and gets exactly the output the page shows; runs the curl
// examples and gets what the page shows; copies a working curl from "Try it out"; follows a
// problem's type to its page; finds its calls in the Request log without the console's own; rolls
// the key choosing the overlap.
import { execFile } from 'node:child_process';
import { mkdirSync, mkdtempSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seed/demo-users.ts';
import { launchBrowser } from '../helpers/browser.ts';
import { JOURNEY_WIDTHS, saveScreen, scrollsSideways, useWidth } from '../helpers/journey-screens.ts';
import { startLiveServer } from '../helpers/live-server.ts';

const run = promisify(execFile);
const ROOT = resolve(import.meta.dirname, '../..');
const INTEGRATOR = 'mes-bridge@kestrelbend.test';
const JOURNEY = 'integrator-quick-start';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let page: Page;
let workdir: string;

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(INTEGRATOR);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /^Welcome, / }).waitFor();
  workdir = mkdtempSync(join(tmpdir(), 'meltwire-journey-'));
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  if (workdir) rmSync(workdir, { recursive: true, force: true });
});

const nav = (label: string) => page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true });

/** The page's sample output as a pattern: "…" stands for what differs from run to run. */
function sampleOutputPattern(shown: string): RegExp {
  const parts = shown.split('…').map((part) => part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&'));
  return new RegExp(`^${parts.join('[\\s\\S]*?')}$`);
}

async function shell(code: string, env: Record<string, string>, cwd = workdir): Promise<string> {
  const { stdout } = await run('bash', ['-c', code], { cwd, env: { ...process.env, ...env } });
  return stdout;
}

describe.each(JOURNEY_WIDTHS)('integrator runs the quick start at %i px', (width) => {
  let secret = '';
  const keyName = `Quick start ${width}`;

  it('issues a key with scopes grouped by resource', async () => {
    await useWidth(page, width);
    await nav('API keys').click();
    await page.getByRole('button', { name: 'Issue a key' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Name').fill(keyName);
    const samples = dialog.getByRole('group', { name: 'Samples and results' });
    expect(await samples.getByRole('checkbox').count()).toBeGreaterThan(1);
    await samples.getByRole('checkbox', { name: 'samples:read' }).check();
    await saveScreen(page, JOURNEY, 'issue-key');
    await dialog.getByRole('button', { name: 'Issue key' }).click();
    secret = (await page.getByTestId('api-key-secret').innerText()).trim();
    expect(secret).toMatch(/^mw_live_/);
    await page.getByRole('button', { name: 'I have stored it' }).click();
    await page.getByRole('cell', { name: keyName, exact: true }).first().waitFor();
  });

  it('saves the TypeScript quick start from the page, runs it as written and gets the output shown', async () => {
    await nav('Quick start').click();
    await page.getByRole('heading', { name: 'Quick start' }).waitFor();
    expect(await scrollsSideways(page)).toBe(false);
    const folder = join(workdir, `w${width}`, 'meltwire-quick-start');
    mkdirSync(folder, { recursive: true });
    for (const file of ['package.json', 'tsconfig.json', 'quick-start.ts']) {
      writeFileSync(join(folder, file), await page.getByTestId(`quick-start-typescript-${file}`).innerText());
    }
    symlinkSync(join(ROOT, 'node_modules'), join(folder, 'node_modules'));
    const steps = await page.getByTestId('quick-start-typescript').innerText();
    expect(steps).toContain('npm install');
    expect(steps).toContain(`export MELTWIRE_URL=${server.url}`);
    // `npm install` would fetch the packages; the repository's node_modules stand in for them.
    const stdout = await shell(steps.replace('npm install', 'true'), { MELTWIRE_KEY: secret }, join(workdir, `w${width}`));
    const shown = await page.getByTestId('quick-start-typescript-output').innerText();
    expect(shown).toContain('key of mes-bridge@kestrelbend.test, scopes: samples:read');
    expect(stdout.trimEnd().endsWith(shown.trimEnd())).toBe(true);
    await saveScreen(page, JOURNEY, 'quick-start');
  }, 90_000);

  it('runs the curl examples and gets what the page shows', async () => {
    const runs = [];
    for (const id of ['first-call', 'list', 'errors']) {
      const output = await shell(await page.getByTestId(`quick-start-${id}`).innerText(), { MELTWIRE_KEY: secret });
      const shown = await page.getByTestId(`quick-start-${id}-output`).innerText();
      runs.push({ id, output: output.replace(/\r/g, '').trim(), shown: shown.trim() });
    }
    for (const { id, output, shown } of runs) expect(output, id).toMatch(sampleOutputPattern(shown));
  });

  it('follows the type of a problem to the page that explains it', async () => {
    const output = await shell(await page.getByTestId('quick-start-errors').innerText(), { MELTWIRE_KEY: secret });
    const type = /"type":"([^"]+)"/.exec(output)?.[1];
    expect(type).toBe('/problems/forbidden');
    await page.goto(new URL(type!, server.url).toString());
    await page.getByRole('heading', { name: /Not allowed/ }).waitFor();
    expect(await page.getByRole('heading', { name: 'What to do' }).isVisible()).toBe(true);
    expect(await page.locator('body').innerText()).toContain('required_scope');
    await saveScreen(page, JOURNEY, 'problem-type');
    await page.goBack();
    await page.getByRole('heading', { name: 'Quick start' }).waitFor();
  });

  it('copies a working curl from "Try it out" in the API reference', async () => {
    await nav('API reference').click();
    const operation = page.getByTestId('api-reference').locator('#operations-Auth-getMe');
    await operation.waitFor();
    await operation.locator('.opblock-summary').click();
    await operation.getByRole('button', { name: 'Try it out' }).click();
    await operation.getByRole('button', { name: 'Execute' }).click();
    const curl = operation.getByTestId('try-it-curl');
    await curl.waitFor();
    const command = await curl.innerText();
    expect(command).toContain('Authorization: Bearer $MELTWIRE_KEY');
    expect(JSON.parse(await shell(command, { MELTWIRE_KEY: secret }))).toMatchObject({ auth: 'api_key', user: { email: INTEGRATOR } });
    await curl.scrollIntoViewIfNeeded();
    await saveScreen(page, JOURNEY, 'try-it-out');
  });

  it("finds the key's calls in the Request log, without the console's own unless asked", async () => {
    await nav('Request log').click();
    await page.getByRole('heading', { name: 'Request log' }).waitFor();
    const rows = page.getByTestId('request-log-row');
    await rows
      .filter({ hasText: `${keyName} (mw_live_` })
      .first()
      .waitFor();
    expect(await rows.filter({ hasText: 'console' }).count()).toBe(0);
    // Every column fits at this width: the last row's Details button is inside the window.
    const details = await rows
      .first()
      .getByRole('button', { name: /^Details of / })
      .boundingBox();
    expect(details!.x + details!.width).toBeLessThanOrEqual(width);
    await saveScreen(page, JOURNEY, 'request-log');
    await page.getByRole('checkbox', { name: /Show the console.s own calls/ }).check();
    await rows.filter({ hasText: 'console' }).first().waitFor();
    expect(await rows.filter({ hasText: `${keyName} (mw_live_` }).count()).toBeGreaterThan(0);
    await saveScreen(page, JOURNEY, 'request-log-with-console');
  });

  it('rolls the key after choosing how long the old one keeps working', async () => {
    await nav('API keys').click();
    const row = page.getByRole('row').filter({ has: page.getByRole('cell', { name: keyName, exact: true }) });
    await row.getByRole('button', { name: 'Roll' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('The old key keeps working for').selectOption({ label: '1 day' });
    expect(await dialog.getByTestId('roll-overlap').innerText()).toMatch(
      /^Calls with the old key keep working until .+, then fail with 401\.$/,
    );
    await saveScreen(page, JOURNEY, 'roll-confirm');
    await dialog.getByRole('button', { name: 'Roll key' }).click();
    const replacement = (await page.getByTestId('api-key-secret').innerText()).trim();
    expect(replacement).not.toBe(secret);
    expect(await page.getByTestId('roll-old-key-stops').innerText()).toMatch(/^The old key keeps working until /);
    await page.getByRole('button', { name: 'I have stored it' }).click();
    for (const key of [secret, replacement]) {
      const res = await fetch(`${server.url}/api/v1/auth/me`, { headers: { authorization: `Bearer ${key}` } });
      expect(res.status).toBe(200);
    }
    const old = await server
      .db('api_keys')
      .where({ prefix: secret.slice(0, 14) })
      .first();
    const hours = (Date.parse(old.expires_at) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(23.9);
    expect(hours).toBeLessThanOrEqual(24);
  });
});
