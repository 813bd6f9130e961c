// The lab manager releases a demo sample from its page, then amends it: the page shows who
// released it, the revision history with the reason and what changed, and the amend action only
// once it is released.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';

let session: Awaited<ReturnType<typeof consoleSession>>;
let page: Page;

beforeAll(async () => {
  session = await consoleSession('lena.marsh@kestrelbend.test');
  page = session.page;
});
afterAll(() => session?.close());

describe('release and amend in the console', () => {
  it('releases a conforming sample, then amends it with a reason, keeping revision 1', async () => {
    await page.goto(`${session.server.url}/samples?heat=K24-0413&kind=final`);
    await page.getByRole('link', { name: 'K24-0413-F1' }).click();
    await page.getByRole('heading', { name: 'Sample K24-0413-F1' }).waitFor();
    expect(await page.getByRole('button', { name: 'Amend…' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Release…' }).click();
    const release = page.getByRole('dialog', { name: 'Release K24-0413-F1' });
    await release.getByLabel('Comment (optional)').fill('Reviewed against SAE 1045');
    await release.getByRole('button', { name: 'Release', exact: true }).click();
    await page.getByTestId('release').waitFor();
    expect(await page.getByTestId('release').innerText()).toMatch(
      /Released by lena\.marsh@kestrelbend\.test at .* revision 1 · “Reviewed against SAE 1045”/,
    );
    expect(await page.getByTestId('revision-row').count()).toBe(1);

    await page.getByRole('button', { name: 'Amend…' }).click();
    const amend = page.getByRole('dialog', { name: /Amend K24-0413-F1/ });
    await amend.getByLabel('Reason (required)').fill('Burn 1 sparked on a pore');
    await amend.getByLabel('Exclude burns (numbers)').fill('1');
    await amend.getByRole('button', { name: 'Amend', exact: true }).click();
    await expect.poll(() => page.getByTestId('revision-row').count()).toBe(2);
    expect(await page.getByTestId('revision-row').nth(1).innerText()).toMatch(/2[\s\S]*Burn 1 sparked on a pore/);
    expect(await page.getByTestId('release').innerText()).toContain('revision 2');
  });

  it('lists the demo grades and defines a new one with limits typed as text, then a second version', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Grades', exact: true }).click();
    const row = (code: string) => page.getByTestId('grade-row').filter({ has: page.getByRole('rowheader', { name: code, exact: true }) });
    expect(await row('AA 6061').innerText()).toMatch(/Si 0\.40–0\.8[\s\S]*others total 0\.15[\s\S]*Al remainder/);

    await page.getByRole('button', { name: 'New grade' }).click();
    const form = page.getByRole('dialog', { name: 'New grade' });
    await form.getByLabel('Code').fill('SAE 1020');
    await form.getByLabel('Title').fill('Low-carbon steel');
    await form.getByLabel('Standard').fill('SAE J403');
    await form.getByLabel(/^Limits/).fill('C 0.18–0.23\nMn 0.30-0.60\nP 0.040\nS 0.050');
    await form.getByLabel('Source').fill('From memory; verify.');
    await form.getByRole('button', { name: 'Create grade' }).click();
    await row('SAE 1020').waitFor();
    expect(await row('SAE 1020').innerText()).toMatch(/C 0\.18–0\.23\s+Mn 0\.30–0\.60\s+P 0\.040\s+S 0\.050/);
    expect(await row('SAE 1020').getByTestId('grade-version').innerText()).toBe('1');

    await row('SAE 1020').getByRole('button', { name: 'New version' }).click();
    const next = page.getByRole('dialog', { name: 'New version of SAE 1020' });
    await next.getByLabel(/^Limits/).fill('C 0.18–0.23\nMn 0.30–0.60\nP 0.030\nS 0.050');
    await next.getByRole('button', { name: 'Save as a new version' }).click();
    await expect.poll(async () => (await row('SAE 1020').innerText()).includes('P 0.030')).toBe(true);
    expect(await row('SAE 1020').getByTestId('grade-version').innerText()).toBe('2');
  });
});
