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
});
