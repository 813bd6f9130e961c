// A quality viewer reads samples through the console: the table with its filters kept in the
// address (so a reload or a shared link shows the same rows), a sample's results, burns and
// flags — but no upload entry and no way to exclude a burn.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';

let session: Awaited<ReturnType<typeof consoleSession>>;
let server: typeof session.server;
let page: Page;

beforeAll(async () => {
  session = await consoleSession('qa.viewer@kestrelbend.test');
  ({ server, page } = session);
});
afterAll(() => session?.close());

const codes = async () => (await page.getByTestId('sample-row').allInnerTexts()).map((text) => text.split(/\s/)[0]);

describe('samples for a viewer', () => {
  it('offers the samples and imports but no upload in the navigation, and lists recent samples on the overview', async () => {
    const labels = await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allInnerTexts();
    expect(labels).toContain('Samples');
    expect(labels).toContain('Imports');
    expect(labels).not.toContain('Upload results');
    await page.getByRole('heading', { name: 'Recent samples' }).waitFor();
    await page.goto(`${server.url}/imports/new`);
    await page.getByText('Not available for your role').waitFor();
    expect(await page.getByLabel('Result file').count()).toBe(0);
  });

  it('filters by verdict: the preliminary samples, taken before alloying, are out of spec', async () => {
    await page.goto(`${server.url}/samples`);
    await page.getByLabel('Verdict').selectOption('false');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL(/conforms=false/);
    await expect.poll(async () => (await codes()).length).toBe(10);
    expect((await codes()).every((code) => code.endsWith('-P1'))).toBe(true);
    expect(await page.getByTestId('sample-row').first().innerText()).toContain('Out of spec');
    await page.getByRole('button', { name: 'Reset' }).click();
    // Every heat and lot sample again: 26 (10 heats × 2 + 6 lots). The list leaves out the 144
    // control points by default; shown, they fill a first page of 50.
    await expect.poll(async () => (await codes()).length).toBe(26);
    await page.getByRole('button', { name: 'Show them too' }).click();
    await page.waitForURL(/controls=shown/);
    await expect.poll(async () => (await codes()).length).toBe(50);
  });

  it('shows a result on a rounding tie as conforming under ASTM E29, and a straddling bound as undecided', async () => {
    const conformanceOf = async (heat: string, code: string) => {
      await page.goto(`${server.url}/samples?heat=${heat}`);
      await page.getByRole('link', { name: code }).click();
      await page.getByRole('heading', { name: `Sample ${code}` }).waitFor();
      return page.getByTestId('conformance');
    };
    const row = (panel: Awaited<ReturnType<typeof conformanceOf>>, element: string) =>
      panel.getByRole('row').filter({ has: page.getByRole('rowheader', { name: element, exact: true }) });
    // Demo heat K24-0417: C averages 0.505 exactly, rounded half to even to the 0.50 maximum.
    const tie = await conformanceOf('K24-0417', 'K24-0417-F1');
    expect(await tie.innerText()).toMatch(/✓ Conforms/);
    expect((await row(tie, 'C').innerText()).split(/\s+/)).toEqual(['C', '✓', 'Within', '0.505', '0.50', '0.43–0.50', '0']);
    // Demo lot B24-0121: Cr reported as <0.050 against the AA 6061 minimum 0.04.
    const lot = await conformanceOf('B24-0121', 'B24-0121-S1');
    expect(await lot.innerText()).toMatch(/\? Cannot decide[\s\S]*against AA 6061/);
    expect(await row(lot, 'Cr').innerText()).toMatch(/\?\s*Cannot decide\s*<0\.050/);
  });

  it('says in words why a result is withheld and that the balance is by difference', async () => {
    await page.goto(`${server.url}/samples?heat=B24-0122`);
    await page.getByRole('link', { name: 'B24-0122-S1' }).click();
    await page.getByRole('heading', { name: 'Sample B24-0122-S1' }).waitFor();
    const ni = page.locator('[data-testid="result-row"][data-element="Ni"]');
    expect(await ni.getByTestId('reported').innerText()).toBe('withheld');
    expect(await ni.innerText()).toContain('Withheld: burns mix values and limits (spark again)');
    const al = page.locator('[data-testid="result-row"][data-element="Al"]');
    expect(await al.innerText()).toContain('Balance, by difference');
    await page.getByText('What the flags mean').waitFor();
    expect(await page.getByText(/usually a failed spark/).count()).toBeGreaterThan(0);
  });

  it('filters the table by heat, keeps the filter in the address and across a reload', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Samples', exact: true }).click();
    await page.getByTestId('sample-row').first().waitFor();
    // The 26 heat and lot samples of the demo; its 144 control points are left out by default.
    await expect.poll(async () => page.getByTestId('sample-row').count()).toBe(26);

    await page.getByLabel('Heat').fill('K24-0412');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL(/\/samples\?heat=K24-0412$/);
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="sample-row"]').length === 2);
    expect(await codes()).toEqual(['K24-0412-F1', 'K24-0412-P1']);

    await page.reload();
    await page.getByTestId('sample-row').first().waitFor();
    expect(await codes()).toEqual(['K24-0412-F1', 'K24-0412-P1']);
    expect(await page.getByLabel('Heat').inputValue()).toBe('K24-0412');

    // The CSV link carries the same filter, control points left out as in the table.
    const href = await page.getByRole('link', { name: /Download CSV/ }).getAttribute('href');
    expect(href).toBe('/api/v1/samples.csv?heat=K24-0412&exclude_kind=control&unit=%25');
    const csv = await page.request.get(`${server.url}${href}`);
    expect(csv.status()).toBe(200);
    const [header, ...rows] = (await csv.text()).trim().split('\n');
    const codeColumn = header.split(',').indexOf('sample_code');
    expect(rows.map((line) => line.split(',')[codeColumn])).toEqual(['K24-0412-F1', 'K24-0412-P1']);

    await page.getByRole('button', { name: 'Reset' }).click();
    await page.waitForURL(/\/samples$/);
  });

  it('shows flags with words and an icon, and an empty state when nothing matches', async () => {
    await page.goto(`${server.url}/samples?flag=repeatability_exceeded`);
    await page.getByTestId('sample-row').first().waitFor();
    // Heat K24-0414's final sample has a Mn burn 10 % high in the demo data (server/seed/demo-samples.ts).
    expect(await codes()).toEqual(['K24-0414-F1']);
    const badge = page.getByTestId('sample-row').locator('[data-flag="repeatability_exceeded"]');
    expect((await badge.innerText()).replace(/\s+/g, ' ')).toBe('⚠ Burns disagree (repeatability exceeded)');
    expect(await badge.getAttribute('title')).toContain('ISO 5725-6 critical range');

    await page.goto(`${server.url}/samples?heat=K99-0000`);
    await page.getByText('No samples match').waitFor();
  });

  it('opens a sample with results, burns and provenance, without exclude buttons', async () => {
    await page.goto(`${server.url}/samples?heat=K24-0414&kind=final`);
    await page.getByRole('link', { name: 'K24-0414-F1' }).click();
    await page.getByRole('heading', { name: 'Sample K24-0414-F1' }).waitFor();
    const mn = page.locator('[data-testid="result-row"][data-element="Mn"]');
    expect(await mn.getByTestId('n').innerText()).toBe('3');
    expect(await mn.innerText()).toContain('Burns disagree (repeatability exceeded)');
    await page.getByText('What the flags mean').waitFor();
    expect(await page.getByTestId('burn-row').count()).toBe(3);
    expect(await page.getByRole('button', { name: /Exclude burn/ }).count()).toBe(0);
    expect(await page.getByText('Pushed as JSON through the API').count()).toBe(1);
    const figureFont = await mn.getByTestId('reported').evaluate((el) => [getComputedStyle(el).fontFamily, getComputedStyle(el).textAlign]);
    expect(figureFont[0]).toMatch(/^"?JetBrains Mono"?/);
    expect(figureFont[1]).toBe('right');

    // The verdict against the grade, with the rule stated and the caution.
    const conformance = page.getByTestId('conformance');
    expect(await conformance.innerText()).toMatch(/✓ Conforms[\s\S]*against SAE 1045 \(version 1\)[\s\S]*Rounding rule \(ASTM E29\)/);
    const carbon = conformance.getByRole('row').filter({ has: page.getByRole('rowheader', { name: 'C', exact: true }) });
    expect(await carbon.innerText()).toMatch(/✓\s*Within[\s\S]*0\.43–0\.50/);
    await page.getByText('A verdict is not a release').waitFor();
    expect(await page.getByText('Draft: not released.').count()).toBe(1);
  });
});
