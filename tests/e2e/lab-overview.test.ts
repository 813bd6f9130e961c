// The console's shell as the lab meets it: the Overview shows the lab's work (drafts to review,
// flags, heats out of spec, corrections in force and control status per instrument) and keeps the
// developer cards for roles that integrate; the navigation folds away (remembered) and lists only
// pages the role can open; the main pages fit a 1024 px tablet without scrolling sideways.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seed/demo-users.ts';
import { launchBrowser } from '../helpers/browser.ts';
import { JOURNEY_WIDTHS, saveScreen, scrollsSideways, useWidth } from '../helpers/journey-screens.ts';
import { startLiveServer } from '../helpers/live-server.ts';

const ANALYST = 'omar.reyes@kestrelbend.test';
const MANAGER = 'lena.marsh@kestrelbend.test';
const INTEGRATOR = 'mes-bridge@kestrelbend.test';

let server: Awaited<ReturnType<typeof startLiveServer>>;
let browser: Awaited<ReturnType<typeof launchBrowser>>;
let page: Page;

beforeAll(async () => {
  server = await startLiveServer();
  browser = await launchBrowser();
  page = await browser.context.newPage();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const navButton = () => page.getByRole('button', { name: 'Navigation' });
const mainNav = () => page.getByRole('navigation', { name: 'Main' });
const heading = (name: string | RegExp) => page.getByRole('heading', { name });

async function signInAs(email: string) {
  await page.context().clearCookies();
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await heading(/^Welcome, /).waitFor();
}

/** The Overview once its lists have loaded. */
async function overviewLoaded() {
  await page.getByRole('list', { name: 'Corrections in force' }).getByTestId('corrections-instrument').first().waitFor();
  await page.getByRole('list', { name: 'Control status' }).getByTestId('control-instrument').first().waitFor();
  await heading(/^Awaiting review \(/).waitFor();
}

describe.each(JOURNEY_WIDTHS)('the lab Overview and the console shell at %i px', (width) => {
  beforeAll(async () => {
    await useWidth(page, width);
  });

  it('shows an analyst the lab work and no developer cards', async () => {
    await signInAs(ANALYST);
    await overviewLoaded();
    for (const title of [/^Awaiting review/, /^Flagged drafts/, /^Out of spec/, 'Recent samples', 'Corrections in force', 'Control status'])
      await heading(title).waitFor();
    const corrections = await page.getByRole('list', { name: 'Corrections in force' }).innerText();
    expect(corrections).toContain('OES-1');
    expect(corrections).toContain('OES-2');
    expect(corrections).toMatch(/measured \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC|No correction set in force/);
    expect(await page.getByRole('list', { name: 'Control status' }).innerText()).toContain('OES-1');
    await page.getByRole('list', { name: 'Instrument feeds' }).waitFor();
    expect(await heading('Start integrating').count()).toBe(0);
    expect(await heading('Server').count()).toBe(0);
    expect(await page.getByText('Scopes', { exact: true }).count()).toBe(0);
    expect(await scrollsSideways(page)).toBe(false);
    await saveScreen(page, 'lab-overview', 'analyst');
  });

  it('lists only pages an analyst can open', async () => {
    const links = mainNav().getByRole('link');
    const labels = await links.allInnerTexts();
    expect(labels).toEqual(expect.arrayContaining(['Overview', 'Samples', 'Imports', 'Upload results', 'Drift', 'Control charts']));
    for (const hidden of ['API keys', 'Request log', 'Webhooks', 'Users', 'Audit trail', 'Outbox']) expect(labels).not.toContain(hidden);
    const targets = await links.evaluateAll((anchors) => anchors.map((a) => a.getAttribute('href') ?? ''));
    for (const target of targets) {
      await page.goto(`${server.url}${target}`);
      await page.locator('main h1').first().waitFor();
      expect(await page.getByText('Not available for your role').count(), target).toBe(0);
    }
  });

  it('keeps Overview, Samples and Imports within the window', async () => {
    for (const [path, title] of [
      ['/', /^Welcome, /],
      ['/samples', 'Samples'],
      ['/imports', 'Imports'],
    ] as const) {
      await page.goto(`${server.url}${path}`);
      await heading(title).first().waitFor();
      await page.waitForLoadState('networkidle');
      expect(await scrollsSideways(page), path).toBe(false);
    }
    await saveScreen(page, 'lab-overview', 'imports');
  });

  it('shows times on one clock and takes dates as yyyy-mm-dd', async () => {
    await page.goto(`${server.url}/samples`);
    const created = page.getByTestId('sample-row').first().locator('time');
    await created.waitFor();
    // The browser runs in the machine's zone (UTC here): local time with its zone named, UTC and the zone on hover, ISO in dateTime.
    expect(await created.innerText()).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC([+-]\d{1,2}(:\d{2})?)?$/);
    expect(await created.getAttribute('dateTime')).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    expect(await created.getAttribute('title')).toMatch(/^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC \(shown in /);

    const from = page.getByLabel('Created from');
    expect(await from.getAttribute('type')).toBe('text');
    expect(await from.getAttribute('placeholder')).toBe('yyyy-mm-dd');
    await from.fill('12/03/2026');
    await from.blur();
    await page.getByText('Write the date as yyyy-mm-dd, e.g. 2026-12-03.').waitFor();
    await from.fill('2026-01-01');
    await from.blur();
    expect(await page.getByText('Write the date as yyyy-mm-dd').count()).toBe(0);
    await saveScreen(page, 'lab-overview', 'date-field');
  });

  it('folds the navigation away, remembers it after a reload, and opens it again', async () => {
    await page.goto(`${server.url}/samples`);
    await heading('Samples').first().waitFor();
    expect(await navButton().getAttribute('aria-expanded')).toBe('true');
    const mainBefore = (await page.locator('main').boundingBox())!.width;
    await navButton().click();
    expect(await navButton().getAttribute('aria-expanded')).toBe('false');
    expect(await mainNav().isVisible()).toBe(false);
    expect((await page.locator('main').boundingBox())!.width).toBeGreaterThan(mainBefore + 100);
    await saveScreen(page, 'lab-overview', 'nav-folded');
    await page.reload();
    await heading('Samples').first().waitFor();
    expect(await navButton().getAttribute('aria-expanded')).toBe('false');
    await navButton().click();
    expect(await navButton().getAttribute('aria-expanded')).toBe('true');
    await mainNav().getByRole('link', { name: 'Samples', exact: true }).waitFor();
  });

  it('shows a manager the lab work and no developer cards either', async () => {
    await signInAs(MANAGER);
    await overviewLoaded();
    await heading(/^Flagged drafts/).waitFor();
    expect(await heading('Start integrating').count()).toBe(0);
    expect(await scrollsSideways(page)).toBe(false);
    await saveScreen(page, 'lab-overview', 'manager');
  });

  it('keeps the developer cards for an integrator', async () => {
    await signInAs(INTEGRATOR);
    await heading('Start integrating').waitFor();
    await heading('Server').waitFor();
    await page.getByText('api-keys:write', { exact: true }).waitFor();
  });
});

describe('on a phone-sized window (390 px)', () => {
  it('starts with the navigation folded, so the page has the width', async () => {
    await page.setViewportSize({ width: 390, height: 800 });
    await signInAs(ANALYST);
    expect(await navButton().getAttribute('aria-expanded')).toBe('false');
    expect((await page.locator('main').boundingBox())!.width).toBeGreaterThan(300);
    await navButton().click();
    await mainNav().getByRole('link', { name: 'Samples', exact: true }).click();
    await heading('Samples').first().waitFor();
    expect(await navButton().getAttribute('aria-expanded')).toBe('false');
    await saveScreen(page, 'lab-overview', 'phone-samples');
  });
});
