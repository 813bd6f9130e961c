// The lab manager on the Drift page: the demo history as a chart with its data table, flagged
// runs readable by icon and word, a standardization run through the form with a failing element,
// and its activation with an override reason — recorded in the audit trail and the events table.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';

const MANAGER = 'lena.marsh@kestrelbend.test';

let session: Awaited<ReturnType<typeof consoleSession>>;
let server: typeof session.server;
let page: Page;

beforeAll(async () => {
  session = await consoleSession(MANAGER);
  ({ server, page } = session);
});
afterAll(() => session?.close());

/** Burns reading every nominal value of a reference 1 % high, except B at 2.2× (a slope near 0.45: fail). */
function burnsFor(values: { element: string; nominal: string }[]): string {
  const burns = [0.999, 1.0, 1.001].map((spread) =>
    Object.fromEntries(
      values.map(({ element, nominal }) => [element, Number((Number(nominal) * (element === 'B' ? 2.2 : 1.01) * spread).toPrecision(5))]),
    ),
  );
  return JSON.stringify(burns);
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

    await page.getByLabel('Element').selectOption('B');
    await page.getByRole('img', { name: /^Slope and offset of B on OES-1/ }).waitFor();
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

  it('runs a standardization from JSON burns and activates it with an override reason', async () => {
    const references = await (await page.request.get(`${server.url}/api/v1/reference-materials?matrix=Fe`)).json();
    const high = references.data.find((r: { code: string }) => r.code === 'KB-FE-HI');
    const low = references.data.find((r: { code: string }) => r.code === 'KB-FE-LO');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Drift', exact: true }).click();
    await page.getByRole('link', { name: 'Run a standardization' }).click();
    await page.getByRole('heading', { name: 'Run a standardization' }).waitFor();
    await page.getByLabel('Instrument', { exact: true }).selectOption({ label: 'OES-1 — Melt shop spark stand' });
    await page.getByLabel('Method', { exact: true }).selectOption({ label: 'FE-LA (Fe base)' });
    await page.getByLabel('Reference material 1').selectOption(high.id);
    await page.getByLabel('Burns of reference 1').fill(burnsFor(high.values));
    await page.getByLabel('Reference material 2').selectOption(low.id);
    await page.getByLabel('Burns of reference 2').fill('not json');
    await page.getByRole('button', { name: 'Compute corrections' }).click();
    await page.getByRole('alert').filter({ hasText: 'Not valid JSON' }).waitFor();
    await page.getByLabel('Burns of reference 2').fill(burnsFor(low.values));
    await page.getByLabel('Note (optional)').fill('B reads high after the argon purge');
    await page.getByRole('button', { name: 'Compute corrections' }).click();

    await page.getByRole('heading', { name: 'Standardization of OES-1 · FE-LA' }).waitFor();
    const runId = page.url().split('/').pop()!;
    const failRows = page.getByTestId('correction-row').filter({ hasText: 'Fail' });
    expect(await failRows.count()).toBe(1);
    expect(await failRows.getByRole('rowheader').innerText()).toBe('B');

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

    const run = await server.db('standardizations').where({ id: runId }).first();
    expect(run).toMatchObject({ status: 'activated', override_reason: reason, activated_by_label: MANAGER });
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
});
