// Journey: an analyst signs off a sample, at a 1024 px tablet and a 1440 px desk. The Samples list
// shows the heats and lots (control points left out, numbers right-aligned); the sample page says
// at the top what needs attention — the burns of Mn disagree on demo heat K24-0414 — and keeps a
// normal "<" trace element quiet; the burns show their unit, as measured or drift-corrected, at
// one precision per element; the exclusion dialog says beforehand that excluding the outlier
// clears the flag and moves Mn, and refuses to go below two burns.
import { Decimal } from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { useConsoleSession } from '../helpers/console-session.ts';
import { JOURNEY_WIDTHS, saveScreen, scrollsSideways, useWidth } from '../helpers/journey-screens.ts';

const session = useConsoleSession('omar.reyes@kestrelbend.test');
const JOURNEY = 'sample-sign-off';
const CODE = 'K24-0414-F1';

const page = () => session.page;
const resultRow = (element: string) => page().locator(`[data-testid="result-row"][data-element="${element}"]`);
const burnRow = (n: number) => page().locator(`[data-testid="burn-row"][data-burn="${n}"]`);
const attention = () => page().getByTestId('attention');
const unitOption = (unit: string) => page().locator('label', { has: page().locator(`input[name="unit"][value="${unit}"]`) });

/** The sample as the API serves it, read with the analyst's own session. */
async function sampleFromApi(unit = '%') {
  const list = await page().request.get(`${session.server.url}/api/v1/samples?sample_code=${CODE}`);
  const [summary] = (await list.json()).data;
  return (await page().request.get(`${session.server.url}/api/v1/samples/${summary.id}?unit=${encodeURIComponent(unit)}`)).json();
}

/** Decimal places written in a figure ("0.7512" → 4). */
const placesOf = (text: string) => (text.includes('.') ? text.split('.')[1].length : 0);

async function openSample() {
  await page().goto(`${session.server.url}/samples?heat=K24-0414`);
  await page().getByRole('link', { name: CODE }).click();
  await page()
    .getByRole('heading', { name: `Sample ${CODE}` })
    .waitFor();
  await resultRow('Mn').waitFor();
}

async function excludeDialog(burn: number) {
  await page()
    .getByRole('button', { name: `Exclude burn ${burn}` })
    .click();
  return page().getByRole('dialog');
}

describe.each(JOURNEY_WIDTHS.map((width, index) => ({ width, first: index === 0 })))(
  'analyst signs off a sample at $width px',
  ({ width, first }) => {
    it('lists heats and lots without control points, numbers right-aligned', async () => {
      await useWidth(page(), width);
      await page().goto(`${session.server.url}/samples`);
      await page().getByTestId('controls-hidden').waitFor();
      // The demo has 26 heat and lot samples (10 heats × 2 + 6 lots) and 144 control points.
      await expect.poll(async () => page().getByTestId('sample-row').count()).toBe(26);
      const kinds = await page()
        .getByTestId('sample-row')
        .evaluateAll((rows) => rows.map((r) => r.children[3].textContent));
      expect(kinds).not.toContain('control');
      const burns = page().getByTestId('sample-row').first().locator('td').nth(6);
      expect(await burns.evaluate((el) => getComputedStyle(el).textAlign)).toBe('right');
      expect(await scrollsSideways(page())).toBe(false);
      // The table fits, or says that it scrolls (the sample code stays in view).
      const table = page().locator('[data-scrolls]');
      if ((await table.getAttribute('data-scrolls')) === 'true') await page().getByTestId('scroll-hint').waitFor();
      // A normal aluminium lot: its notes ("<" Pb, Al by difference) folded into a quiet count, no badge.
      const lot = page().getByTestId('sample-row').filter({ hasText: 'B24-0118-S1' });
      expect(await lot.locator('[data-flag]').count()).toBe(0);
      expect(await lot.getByTestId('note-count').innerText()).toMatch(/^\+ \d notes?$/);
      await saveScreen(page(), JOURNEY, 'samples-list');

      // That lot's page is quiet too: nothing needs attention, Pb "<0.002" said as normal, fields by their label.
      await lot.getByRole('link', { name: 'B24-0118-S1' }).click();
      await attention().getByText('✓ Nothing in the results needs attention').waitFor();
      expect(await attention().getByTestId('at-limit').innerText()).toContain('Pb <0.002');
      expect(await resultRow('Pb').locator('[data-tone="check"], [data-tone="problem"]').count()).toBe(0);
      expect(await page().getByTestId('sample-identity').innerText()).toMatch(/Casting station\s+VDC-1/);
      await saveScreen(page(), JOURNEY, 'quiet-lot');
      await page().goto(`${session.server.url}/samples`);

      await page().getByRole('button', { name: 'Show them too' }).click();
      await page().waitForURL(/controls=shown/);
      await expect.poll(async () => page().getByTestId('sample-row').count()).toBe(50); // a full first page
    });

    it('says at the top that the Mn burns disagree, and keeps a normal "<" trace element quiet', async () => {
      await openSample();
      if (!first) {
        // The 1024 px journey excluded burn 3: include it again; the preview says the flag comes back.
        await page().getByRole('button', { name: 'Include burn 3' }).click();
        const dialog = page().getByRole('dialog');
        await dialog.getByTestId('exclusion-preview').waitFor();
        expect(await dialog.getByTestId('preview-change').filter({ hasText: 'Mn' }).innerText()).toContain(
          'raises “Burns disagree (repeatability exceeded)”',
        );
        await dialog.getByLabel('Reason (required)').fill('Checked the burn mark again: no pore');
        await dialog.getByRole('button', { name: 'Include burn' }).click();
        await burnRow(3).and(page().locator('[data-excluded="false"]')).waitFor();
      }
      const top = attention();
      await top.getByText('Needs attention before release').waitFor();
      const problem = top.locator('[data-attention="repeatability_exceeded"]');
      expect(await problem.innerText()).toMatch(/Burns disagree \(repeatability exceeded\)[\s\S]*Mn: burns span/);
      expect(await problem.locator('[data-flag]').getAttribute('data-tone')).toBe('problem');
      // Nb is "<0.003" in every burn of the demo steel (reported "<" the method's lowest reportable value):
      // said quietly, not listed, and no label says "qualified".
      expect(await top.locator('[data-attention]').count()).toBe(1);
      expect(await top.getByTestId('at-limit').innerText()).toMatch(/Nb <0\.\d+/);
      expect((await page().locator('main').innerText()).toLowerCase()).not.toContain('qualified');
      const nb = resultRow('Nb');
      expect(await nb.locator('[data-flag]').evaluateAll((flags) => flags.map((f) => f.getAttribute('data-tone')))).not.toContain('check');
      // The summary comes before everything else on the page.
      const order = await page().evaluate(() => {
        const summary = document.querySelector('[data-testid="attention"]')!;
        const results = document.getElementById('results-heading')!;
        return summary.compareDocumentPosition(results) & Node.DOCUMENT_POSITION_FOLLOWING;
      });
      expect(order).toBeTruthy();
      await saveScreen(page(), JOURNEY, 'attention');
    });

    it('shows the burns with their unit, as measured or corrected, at one precision per element, with a sticky element column', async () => {
      const api = await sampleFromApi();
      const mn = api.results.find((r: { element: string }) => r.element === 'Mn');
      expect(await page().getByTestId('burns-view').innerText()).toMatch(/Values in %, (drift-corrected|as measured)/);
      const header = page()
        .locator('table')
        .filter({ has: page().getByTestId('burn-row') })
        .locator('thead th');
      expect(await header.filter({ hasText: /^Mn/ }).innerText()).toMatch(/Mn\s*%/);
      const mnCells = await page().locator('[data-testid="burn-row"] td[data-element="Mn"]').allInnerTexts();
      expect(new Set(mnCells.map(placesOf))).toEqual(new Set([mn.decimals + 2]));
      // The mean row averages the burns in the same view: the result's mean at the same precision.
      const meanRow = page().getByTestId('burns-mean-row');
      const shownMean = await meanRow.locator('td[data-element="Mn"]').innerText();
      expect(shownMean).toBe(new Decimal(mn.mean).toDecimalPlaces(mn.decimals + 2, Decimal.ROUND_HALF_EVEN).toFixed(mn.decimals + 2));
      if (api.correction) {
        await page().getByText('As measured', { exact: true }).click();
        await expect.poll(() => page().getByTestId('burns-view').innerText()).toMatch(/as measured/);
        const raw = new Decimal(mn.raw_mean).toDecimalPlaces(mn.decimals + 2, Decimal.ROUND_HALF_EVEN).toFixed(mn.decimals + 2);
        expect(await meanRow.locator('td[data-element="Mn"]').innerText()).toBe(raw);
        await page().getByText('Drift-corrected', { exact: true }).click();
      }
      // The element (burn) column stays in view; the table either fits or says it scrolls.
      const firstCell = burnRow(1).locator('th');
      expect(await firstCell.evaluate((el) => getComputedStyle(el).position)).toBe('sticky');
      const region = page().locator('section[aria-labelledby="burns-heading"] [data-scrolls]');
      if ((await region.getAttribute('data-scrolls')) === 'true') {
        expect(await page().getByTestId('scroll-hint').first().innerText()).toContain('scroll sideways');
        await region.evaluate((el) => el.scrollBy({ left: 400 }));
        const box = await firstCell.boundingBox();
        const regionBox = await region.boundingBox();
        expect(Math.abs(box!.x - regionBox!.x)).toBeLessThan(3);
      }
      expect(await scrollsSideways(page())).toBe(false);
      // Custom fields by their label, not their key.
      expect(await page().getByTestId('sample-identity').innerText()).toMatch(/Furnace\s+EAF-2/);
      await saveScreen(page(), JOURNEY, 'burns');
    });

    it('warns that excluding the outlier clears the flag and moves Mn, then keeps two burns at least', async () => {
      const before = await sampleFromApi();
      const mnBurns = before.burns.map((b: { values: { Mn: { value: number; corrected: { value: number } | null } } }) =>
        String((b.values.Mn.corrected ?? b.values.Mn).value),
      );
      const mn = before.results.find((r: { element: string }) => r.element === 'Mn');
      // Independent: the mean of burns 1 and 2 with decimal.js, rounded half to even (ASTM E29) to the method's decimals.
      const expectedAfter = new Decimal(mnBurns[0])
        .plus(mnBurns[1])
        .div(2)
        .toDecimalPlaces(mn.decimals, Decimal.ROUND_HALF_EVEN)
        .toFixed(mn.decimals);

      const dialog = await excludeDialog(3);
      const preview = dialog.getByTestId('exclusion-preview');
      await preview.waitFor();
      expect(await dialog.innerText()).toContain('This clears a flag and changes the results');
      const change = await preview.getByTestId('preview-change').filter({ hasText: 'Mn' }).innerText();
      expect(change).toContain(`reported ${mn.reported} → ${expectedAfter} %`);
      expect(change).toContain('clears “Burns disagree (repeatability exceeded)”');
      await saveScreen(page(), JOURNEY, 'exclusion-preview');
      await dialog.getByLabel('Reason (required)').fill('Pore at the burn mark, seen under the loupe');
      await dialog.getByRole('button', { name: 'Exclude burn' }).click();
      await burnRow(3).and(page().locator('[data-excluded="true"]')).waitFor();
      await expect.poll(() => resultRow('Mn').getByTestId('reported').innerText()).toBe(expectedAfter);
      expect(await resultRow('Mn').getByTestId('n').innerText()).toBe('2');
      await attention().getByText('✓ Nothing in the results needs attention').waitFor();

      // Two burns left: the method (default) keeps at least two included; the dialog says so before anything is sent.
      const refusal = await excludeDialog(2);
      await refusal.getByTestId('preview-refusal').waitFor();
      expect(await refusal.getByTestId('preview-refusal').innerText()).toBe(
        'Method FE-LA needs at least 2 included burns for a result, and this would leave 1. Spark the sample again (or include another burn first), then exclude this one.',
      );
      expect(await refusal.getByRole('button', { name: 'Exclude burn' }).isDisabled()).toBe(true);
      await saveScreen(page(), JOURNEY, 'exclusion-refused');
      await refusal.getByRole('button', { name: 'Cancel' }).click();
      expect(await burnRow(2).getAttribute('data-excluded')).toBe('false');
    });

    it('reports in ppm from the mean in ppm, at whole ppm for every element', async () => {
      await unitOption('ppm').click();
      await page().waitForURL(/unit=ppm/);
      const ppm = await sampleFromApi('ppm');
      for (const element of ['Si', 'Mn', 'C']) {
        const r = ppm.results.find((x: { element: string }) => x.element === element);
        // 1 % = 10 000 ppm (NIST SP 811); whole ppm, half to even from the ppm mean (decimal.js).
        const expected = new Decimal(r.mean).toDecimalPlaces(0, Decimal.ROUND_HALF_EVEN).toFixed(0);
        await expect.poll(() => resultRow(element).getByTestId('reported').innerText()).toBe(expected);
        expect(await resultRow(element).getByTestId('step').innerText()).toBe('1');
      }
      expect(await page().getByTestId('rounding-note').innerText()).toContain('whole ppm');
      await saveScreen(page(), JOURNEY, 'ppm');
      await unitOption('%').click();
      await page().waitForURL((url) => !url.search.includes('unit='));
    });
  },
);
