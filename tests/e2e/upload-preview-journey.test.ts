// Journey: an analyst previews a file with ambiguous columns — "CE %" (a carbon equivalent that
// would be read as cerium), "Fe %" (the balance on a steel method) and "Co %" (not in the method)
// — decides each one, saves the choices into an import profile, and imports sample by sample
// around a line whose 300-digit burn number cannot be read. At 1024 px and 1440 px, with screenshots.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';
import { JOURNEY_WIDTHS, saveScreen, scrollsSideways, useWidth } from '../helpers/journey-screens.ts';

const JOURNEY = 'upload-preview';
const LONG_NUMBER = '9'.repeat(300);

// Invented values (Kestrel Bend melt shop).
function fileFor(width: number): string {
  const heat = `K24-${width}`;
  return [
    'Sample,Heat,Burn,C %,Mn %,CE %,Fe %,Co %',
    `${heat}-F1,${heat},1,0.452,0.75,0.58,98.10,0.004`,
    `${heat}-F1,${heat},2,0.448,0.76,0.57,98.11,0.005`,
    `${heat}-F2,${heat},1,0.20,0.80,0.34,98.60,0.003`,
    `${heat}-F2,${heat},2,0.21,0.81,0.35,98.58,0.003`,
    `${heat}-F3,${heat},${LONG_NUMBER},0.30,0.90,0.45,98.40,0.004`,
    '',
  ].join('\n');
}

let session: Awaited<ReturnType<typeof consoleSession>>;
let page: Page;

beforeAll(async () => {
  session = await consoleSession('omar.reyes@kestrelbend.test');
  page = session.page;
});
afterAll(() => session?.close());

const decision = (header: string) => page.locator(`[data-testid="column-decision"][data-header="${header}"]`);
const columnRow = (header: string) => page.getByTestId('column-row').filter({ has: page.locator('td', { hasText: header }) });

describe('previews a file with an ambiguous column', () => {
  for (const width of JOURNEY_WIDTHS) {
    it(`decides CE, Fe and Co before import and imports what was decided, at ${width} px`, { timeout: 120_000 }, async () => {
      await useWidth(page, width);
      const fileName = `oes-1-ce-${width}.csv`;
      await page.goto(`${session.server.url}/imports/new`);
      await page.getByLabel('Instrument').selectOption({ label: 'OES-1 — Melt shop spark stand' });
      await page.getByLabel('Method').selectOption({ label: 'FE-LA — Low-alloy steel (Fe base)' });
      await page.getByLabel('Result file').setInputFiles({ name: fileName, mimeType: 'text/csv', buffer: Buffer.from(fileFor(width)) });
      await page.getByRole('button', { name: 'Preview' }).click();
      await page.getByTestId('import-preview').waitFor();

      // Every column's reading, and the three doubtful ones called out before anything is stored.
      expect(await columnRow('C %').innerText()).toMatch(/Element\s+Element C, in %\s+Detected from the header/);
      expect(await columnRow('CE %').getAttribute('data-attention')).toBe('computed_index');
      expect(await columnRow('CE %').innerText()).toContain('Element Ce, in %');
      const panel = page.getByTestId('column-decisions');
      expect(await panel.getByRole('heading').innerText()).toContain('3 columns need a decision before import');
      expect(await decision('CE %').innerText()).toContain('carbon equivalent');
      expect(await decision('Fe %').innerText()).toContain('the balance');
      expect(await decision('Co %').innerText()).toContain('does not list');
      // The import waits for CE and Fe; Co is kept unless someone decides otherwise.
      const commit = page.getByRole('region', { name: 'Import' });
      await commit.getByText('Decide the flagged columns first').waitFor();
      expect(await commit.getByRole('button', { name: /^Import/ }).isDisabled()).toBe(true);
      expect(
        await decision('Co %')
          .getByRole('radio', { name: /Keep it as read/ })
          .isChecked(),
      ).toBe(true);

      // The 300-digit burn number is clipped inside its cell, the whole value on hover.
      const rejected = page.getByTestId('preview-rejected');
      const clipped = rejected.locator('[data-clipped="true"]', { hasText: '999999' }).first();
      expect(await clipped.getAttribute('title')).toBe(`"${LONG_NUMBER}"`);
      const cellBox = (await clipped.boundingBox())!;
      const tableBox = (await rejected.locator('table').boundingBox())!;
      expect(cellBox.x + cellBox.width).toBeLessThanOrEqual(tableBox.x + tableBox.width);
      expect(await rejected.locator('table').evaluate((t) => t.scrollWidth <= t.parentElement!.clientWidth + 1)).toBe(true);
      expect(await scrollsSideways(page)).toBe(false);
      await saveScreen(page, JOURNEY, 'flagged');

      // Saving without a choice for CE and Fe says what is missing, beside each.
      await panel.getByRole('button', { name: 'Save the choices as a new profile' }).click();
      await decision('CE %').getByText('Choose what to do with this column.').waitFor();
      await decision('CE %')
        .getByRole('radio', { name: /identification field/ })
        .check();
      expect(await decision('CE %').getByLabel('Field name for CE %').inputValue()).toBe('carbon_equivalent');
      await decision('Fe %')
        .getByRole('radio', { name: /Ignore it/ })
        .check();
      expect(await panel.getByLabel('Name of the new import profile').inputValue()).toBe(`Columns of ${fileName}`);
      await panel.getByRole('button', { name: 'Save the choices as a new profile' }).click();

      // The file is read again with the new profile: nothing left to decide.
      await page.getByTestId('column-decisions').waitFor({ state: 'detached' });
      await page.waitForFunction(() => !document.querySelector('[data-attention]'));
      expect(await columnRow('CE %').innerText()).toMatch(/Identification field “carbon_equivalent”\s+Import profile/);
      expect(await columnRow('Fe %').innerText()).toMatch(/Not imported\s+Import profile/);
      expect(await columnRow('Co %').innerText()).toMatch(/Element Co, in %\s+Confirmed in the profile/);
      const profileSelect = page.getByLabel('Import profile (optional)');
      expect(await profileSelect.locator('option:checked').innerText()).toBe(`Columns of ${fileName}`);

      // Plain words: whole file refused because of the unreadable line; sample by sample stores two.
      await commit.getByText('This file would be refused whole').waitFor();
      expect(await commit.getByTestId('import-plan').innerText()).toContain('1 line cannot be read');
      expect(await commit.getByRole('button', { name: 'Import the whole file' }).isDisabled()).toBe(true);
      await commit.getByRole('radio', { name: /Sample by sample/ }).check();
      expect(await commit.getByTestId('import-plan').innerText()).toMatch(
        /2 samples will be added to the lab's results\. The line that cannot be read is left out and listed in the report\./,
      );
      expect(await scrollsSideways(page)).toBe(false);
      await saveScreen(page, JOURNEY, 'decided');
      await commit.getByRole('button', { name: 'Import 2 samples, leave out 1 line' }).click();

      // The report: flags per element, and the decisions honoured in what was stored.
      const report = page.getByTestId('import-report');
      await report.waitFor();
      const summary = page.getByTestId('flag-summary');
      const coRow = summary.locator('[data-testid="flag-summary-row"][data-element="Co"][data-flag="not_in_method"]');
      expect(await coRow.innerText()).toMatch(/Co\s+Not in the method: not reported\s+2 of 2/);
      expect(await summary.locator('[data-element="Ce"]').count()).toBe(0);
      expect(await summary.locator('[data-element="Fe"]').count()).toBe(0);
      const samplesLink = await coRow.getByRole('link').getAttribute('href');
      expect(samplesLink).toMatch(/\/samples\?import_id=imp_\w+&flag=not_in_method$/);
      expect(await scrollsSideways(page)).toBe(false);
      await saveScreen(page, JOURNEY, 'report');

      const stored = await session.server
        .db('samples')
        .where({ sample_code: `K24-${width}-F1` })
        .first();
      expect(JSON.parse(stored.fields_json)).toMatchObject({ carbon_equivalent: '0.58' });
      const elements = (JSON.parse(stored.results_json) as { element: string }[]).map((r) => r.element);
      expect(elements).toEqual(expect.arrayContaining(['C', 'Mn', 'Co']));
      expect(elements).not.toContain('Ce');
      expect(elements).not.toContain('Fe');
      const profile = await session.server
        .db('import_profiles')
        .where({ name: `Columns of ${fileName}` })
        .first();
      expect(JSON.parse(profile.definition_json)).toMatchObject({
        ignore_columns: ['Fe %'],
        keep_columns: ['Co %'],
        columns: { fields: { carbon_equivalent: 'CE %' } },
      });
      // The raw file is kept byte for byte, with the line that was left out.
      const raw = await page.request.get(
        `${session.server.url}${await report.getByRole('link', { name: /raw file/ }).getAttribute('href')}`,
      );
      expect((await raw.body()).toString('utf8')).toBe(fileFor(width));
    });
  }
});
