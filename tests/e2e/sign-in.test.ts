// Signs in through the built console in headless chromium, as each demo role.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seed/demo-users.ts';
import { launchBrowser } from '../helpers/browser.ts';
import { startLiveServer } from '../helpers/live-server.ts';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
});
// One browser profile for the file: each test starts signed out.
beforeEach(() => browser.context.clearCookies());
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${server.url}/`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

async function navLabels(page: Page): Promise<string[]> {
  return page.getByRole('navigation', { name: 'Main' }).getByRole('link').allInnerTexts();
}

describe('console sign-in', () => {
  it('shows a readable message for wrong credentials, next to the form', async () => {
    const page = await browser.context.newPage();
    await signIn(page, 'admin@kestrelbend.test', 'not the password');
    await expect(page.getByRole('alert').first().innerText()).resolves.toContain('The e-mail or password is not correct.');
    expect(page.url()).toContain('/sign-in');
    await page.close();
  });

  it('signs the demo admin in and shows health, version and the admin navigation', async () => {
    const page = await browser.context.newPage();
    await signIn(page, 'admin@kestrelbend.test');
    await page.getByRole('heading', { name: /Welcome, Ines Okafor/ }).waitFor();
    await expect(page.getByTestId('server-version').innerText()).resolves.toMatch(/^\d+\.\d+\.\d+$/);
    expect(await navLabels(page)).toEqual([
      'Overview',
      'Samples',
      'Imports',
      'Upload results',
      'Drift',
      'Control charts',
      'Grades',
      'Quick start',
      'Webhooks',
      'Events feed',
      'API keys',
      'API reference',
      'Request log',
      'Users',
      'Audit trail',
      'Outbox',
    ]);

    await page.getByRole('link', { name: 'Users' }).click();
    await page.getByRole('cell', { name: 'qa.viewer@kestrelbend.test' }).waitFor();

    await page.goto(`${server.url}/no-such-page`);
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.close();
  });

  it('gives a viewer the reader navigation only, and explains a page their role cannot open', async () => {
    const page = await browser.context.newPage();
    await signIn(page, 'qa.viewer@kestrelbend.test');
    await page.getByTestId('current-role').filter({ hasText: 'viewer' }).waitFor();
    expect(await navLabels(page)).toEqual([
      'Overview',
      'Samples',
      'Imports',
      'Drift',
      'Control charts',
      'Grades',
      'Quick start',
      'Events feed',
      'API reference',
    ]);
    await page.goto(`${server.url}/users`);
    await page.getByText('Not available for your role').waitFor();
    await page.close();
  });

  it('returns to the requested page after signing in', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${server.url}/audit`);
    await page.waitForURL(/\/sign-in\?next=%2Faudit/);
    await page.getByLabel('E-mail').fill('lena.marsh@kestrelbend.test');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Audit trail' }).waitFor();
    await page.getByRole('cell', { name: 'session.signed_in' }).first().waitFor();
    await page.close();
  });
});
