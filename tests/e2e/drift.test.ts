// The lab manager on the Drift page: the demo history as a chart with its data table, flagged
// runs readable by icon and word, a standardization run through the form with a failing element,
// read from the instrument's result file (codes matched or mapped, a value corrected in the grid)
// at 1024 and 1440 px, and its activation with an override reason — recorded in the audit trail and the events table.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';
import { JOURNEY_WIDTHS, saveScreen, scrollsSideways, useWidth } from '../helpers/journey-screens.ts';

const MANAGER = 'lena.marsh@kestrelbend.test';

let session: Awaited<ReturnType<typeof consoleSession>>;
let server: typeof session.server;
let page: Page;

beforeAll(async () => {
  session = await consoleSession(MANAGER);
  ({ server, page } = session);
});
afterAll(() => session?.close());

interface Reference {
  id: string;
  code: string;
  values: { element: string; nominal: string }[];
}

/** Burns reading every nominal value of a reference 1 % high, except B at 2.2× (a slope near 0.45: fail). */
function burnsFor(reference: Reference, element: string): string[] {
  const nominal = reference.values.find((v) => v.element === element)?.nominal;
  if (nominal === undefined) return ['', '', ''];
  return [0.999, 1.0, 1.001].map((spread) => String(Number((Number(nominal) * (element === 'B' ? 2.2 : 1.01) * spread).toPrecision(5))));
}

/**
 * The result file of a standardization session as an instrument writes it: the high reference
 * under a code written its own way (matched ignoring case and separators), the low one under a
 * code of the instrument's (mapped by hand), and a production sample sparked in the same session.
 */
function sessionFile(high: Reference, low: Reference, sparkedAt: Date): string {
  const elements = [...new Set([...high.values, ...low.values].map((v) => v.element))];
  const time = (minutes: number) => new Date(sparkedAt.getTime() + minutes * 60_000).toISOString();
  const lines = [`Sample,Burn,Time,${elements.map((e) => `${e} %`).join(',')}`];
  const add = (code: string, reference: Reference, start: number) =>
    [0, 1, 2].forEach((burn) =>
      lines.push([code, burn + 1, time(start + burn), ...elements.map((e) => burnsFor(reference, e)[burn])].join(',')),
    );
  add(high.code.toLowerCase().replace(/-/g, ' '), high, 0);
  add('SETUP LOW 2', low, 4);
  lines.push(['K24-0412-F1', 1, time(9), ...elements.map((e) => (e === 'C' ? '0.41' : ''))].join(','));
  return `${lines.join('\n')}\n`;
}

describe('Drift page', () => {
  it('shows the demo drift history as a chart with a data table, flagged runs told by icon and word', async () => {
    await page.getByRole('heading', { name: /Welcome, Lena Marsh/ }).waitFor();

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Drift', exact: true }).click();
    const chart = page.getByRole('img', { name: /^Slope and offset of C on OES-1: 14 standardization runs/ });
    await chart.waitFor();
    expect(await chart.locator('.recharts-line').count()).toBe(2);
    const axes = await chart.locator('.recharts-label').allTextContents();
    expect(axes).toEqual(expect.arrayContaining(['Slope α', 'Offset β (%)', 'Measured (UTC date)']));

    await saveScreen(page, 'drift-chart', 'carbon');
    // Round ticks on both axes (no 0.9771 or 1.0413 labels).
    const ticks = await chart.locator('.recharts-yAxis-tick-labels .recharts-cartesian-axis-tick-value').allTextContents();
    expect(ticks.length).toBeGreaterThan(4);
    for (const tick of ticks) expect(tick).toMatch(/^-?\d+(\.\d{1,4})?$/);

    await page.getByLabel('Element').selectOption('B');
    const bChart = page.getByRole('img', {
      name: /^Slope and offset of B on OES-1: 14 standardization runs .*, 2 of them drafts never activated \(shown off the line\)/,
    });
    await bChart.waitFor();
    // The failed draft (slope 0.45) is a loose point, not part of the line; the fail band shows where it fell.
    expect(await bChart.locator('.recharts-scatter-symbol').count()).toBe(4);
    expect(await bChart.locator('.drift-band-fail').count()).toBeGreaterThan(0);
    // B is reported to 0.0001 %: its offsets are in ppm.
    expect(await bChart.locator('.recharts-label').allTextContents()).toContain('Offset β (ppm)');
    await saveScreen(page, 'drift-chart', 'boron');
    const table = page.getByTestId('drift-table');
    await table.getByText('Data table (14 runs)').click();
    const rows = table.getByRole('table', { name: 'Drift of B on OES-1' }).locator('tbody tr');
    expect(await rows.count()).toBe(14);
    const failing = rows.filter({ hasText: 'Fail' });
    expect(await failing.count()).toBe(1);
    expect(await failing.innerText()).toMatch(/✕\s*Fail[\s\S]*Draft/);
    expect(await rows.filter({ hasText: 'In force' }).count()).toBe(1);

    await failing.getByRole('link', { name: /^Open the run of/ }).click();
    const bRow = page.getByTestId('correction-row').filter({ has: page.getByRole('rowheader', { name: 'B', exact: true }) });
    await bRow.waitFor();
    expect(await bRow.getAttribute('data-flag')).toBe('fail');
    expect(await bRow.innerText()).toMatch(
      /✕\s*Fail[\s\S]*Slope 0\.\d+ is 0\.\d+ away from 1: more than the fail limit 0\.5 of method FE-LA\. Activating it needs an override reason\./,
    );
    // A run older than the set in force cannot be activated: the page says so instead of offering it.
    await page.getByText('A draft that can no longer be activated').waitFor();
    expect(await page.getByRole('button', { name: 'Activate…' }).count()).toBe(0);
  });

  for (const [round, width] of JOURNEY_WIDTHS.entries()) {
    it(`runs a standardization from a file at ${width} px: mapped, corrected by hand, activated with an override`, async () => {
      await useWidth(page, width);
      const references = await (await page.request.get(`${server.url}/api/v1/reference-materials?matrix=Fe`)).json();
      const high: Reference = references.data.find((r: Reference) => r.code === 'KB-FE-HI');
      const low: Reference = references.data.find((r: Reference) => r.code === 'KB-FE-LO');
      // Each round sparks later than the one before, so that its run can be activated after it.
      const sparkedAt = new Date(Date.now() - (40 - round * 20) * 60_000);
      const lastBurn = new Date(sparkedAt.getTime() + 6 * 60_000).toISOString();

      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Drift', exact: true }).click();
      await page.getByRole('link', { name: 'Run a standardization' }).click();
      await page.getByRole('heading', { name: 'Run a standardization' }).waitFor();
      // The steel stand defaults to the method it is standardized with, not the first in the list.
      const instrument = page.getByLabel('Instrument', { exact: true });
      expect(await instrument.locator('option:checked').innerText()).toBe('OES-1 — Melt shop spark stand');
      await page.getByText('The method this instrument was last standardized with.').waitFor();
      expect(await page.getByLabel('Method', { exact: true }).locator('option:checked').innerText()).toBe('FE-LA (Fe base)');

      await page.getByLabel('Result file').setInputFiles({
        name: `session-${width}.csv`,
        mimeType: 'text/csv',
        buffer: Buffer.from(sessionFile(high, low, sparkedAt)),
      });
      await page.getByRole('button', { name: 'Read the file' }).click();
      const samples = page.getByTestId('file-sample');
      await samples.first().waitFor();
      expect(await samples.count()).toBe(3);
      const highSelect = page.getByLabel(/^Reference material for kb fe hi$/);
      expect(await highSelect.locator('option:checked').innerText()).toBe('KB-FE-HI (high)');
      await samples.first().getByText('matched by its code').waitFor();
      const lowSelect = page.getByLabel('Reference material for SETUP LOW 2');
      expect(await lowSelect.locator('option:checked').innerText()).toBe('Not a reference (leave out)');
      await lowSelect.selectOption({ label: 'KB-FE-LO (low)' });

      // The burns land in the grids; the time is the latest burn of the references, not of the production sample.
      const cell = (reference: string, burn: number, element: string) =>
        page.getByLabel(`${reference}, burn ${burn}, ${element}`, { exact: true });
      expect(await cell('High reference', 1, 'C').inputValue()).toBe(burnsFor(high, 'C')[0]);
      expect(await cell('Low reference', 3, 'Mn').inputValue()).toBe(burnsFor(low, 'Mn')[2]);
      expect(await page.getByLabel('Measured at (ISO 8601 with zone)').inputValue()).toBe(lastBurn);

      // A value typed wrong by hand is refused in its cell, then corrected there.
      await cell('Low reference', 2, 'Mn').fill('0.5x');
      await page.getByRole('button', { name: 'Compute corrections' }).click();
      await page.getByText(/1 value\(s\) cannot be read; they are outlined in the grid/).waitFor();
      expect(await cell('Low reference', 2, 'Mn').getAttribute('aria-invalid')).toBe('true');
      await saveScreen(page, 'standardization-from-file', 'form');
      expect(await scrollsSideways(page)).toBe(false);
      await cell('Low reference', 2, 'Mn').fill(burnsFor(low, 'Mn')[1]);
      await page.getByLabel('Note (optional)').fill('B reads high after the argon purge');
      await page.getByRole('button', { name: 'Compute corrections' }).click();

      await page.getByRole('heading', { name: 'Standardization of OES-1 · FE-LA' }).waitFor();
      await page.getByText(`session-${width}.csv`).waitFor();
      const runId = page.url().split('/').pop()!;
      const failRows = page.locator('[data-testid="correction-row"][data-flag="fail"]');
      expect(await failRows.count()).toBe(1);
      expect(await failRows.getByRole('rowheader').innerText()).toBe('B');
      // Each element shows what each reference should read and did read, and how far the slope moved from the set before.
      const cRow = page.getByTestId('correction-row').filter({ has: page.getByRole('rowheader', { name: 'C', exact: true }) });
      const cText = await cRow.innerText();
      expect(cText).toContain('KB-FE-HI');
      expect(cText).toContain(high.values.find((v) => v.element === 'C')!.nominal);
      expect(await cRow.getByTestId('slope-change').innerText()).toMatch(/^([+−]\d+\.\d|0\.0) %$/);
      // The journey's burns read 1 % high everywhere, so a slope that had drifted several % in the demo moves back: told in words.
      const moved = page.getByTestId('correction-row').filter({ hasText: /moved [+−]\d+(\.\d)? % from [\d.]+ of the set before/ });
      expect(await moved.count()).toBeGreaterThan(0);
      await saveScreen(page, 'standardization-from-file', 'run');
      expect(await scrollsSideways(page)).toBe(false);

      await page.getByRole('button', { name: 'Activate…' }).click();
      const dialog = page.getByRole('dialog', { name: 'Activate with an override' });
      await dialog.getByText('B is flagged Fail').waitFor();
      const confirm = dialog.getByRole('button', { name: 'Activate with override' });
      expect(await confirm.isDisabled()).toBe(true);
      const reason = 'B is not reported on foundry certificates this week; other elements checked against the control sample';
      await dialog.getByLabel('Override reason').fill(reason);
      await confirm.click();
      await page.getByTestId('override-reason').filter({ hasText: reason }).waitFor();
      await page.getByText('● In force').waitFor();
      await saveScreen(page, 'standardization-from-file', 'activated');

      const run = await server.db('standardizations').where({ id: runId }).first();
      expect(run).toMatchObject({ status: 'activated', override_reason: reason, activated_by_label: MANAGER, measured_at: lastBurn });
      expect(JSON.parse(run.source_file_json)).toMatchObject({ name: `session-${width}.csv` });
      const audit = await server.db('audit_events').where({ action: 'standardization.activated', target_id: runId });
      expect(audit).toHaveLength(1);
      expect(audit[0].actor_label).toBe(MANAGER);
      const events = (await server.db('events').where({ type: 'standardization.activated' })).map((e: { data_json: string }) =>
        JSON.parse(e.data_json),
      );
      expect(events.filter((e: { standardization: { id: string } }) => e.standardization.id === runId)).toEqual([
        expect.objectContaining({
          standardization: expect.objectContaining({ override_reason: reason, flag: 'fail' }),
          activated_by: MANAGER,
        }),
      ]);
    });
  }
});
