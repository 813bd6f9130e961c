// An analyst's day with the console: upload a result file (preview, then import with progress),
// read the import report, open a sample, exclude a burn with a reason and see the results change;
// a broken file and an oversized file answer readably, and nothing is stored for them.
import { createHash } from 'node:crypto';
import { Decimal } from 'decimal.js';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { consoleSession } from '../helpers/console-session.ts';

const ANALYST = 'omar.reyes@kestrelbend.test';
const LIMIT = 50_000; // a small IMPORT_MAX_BYTES, so the 413 needs only a small file

// Invented values. Mn of K24-0950-F1: burns 0.75, 0.76, 0.71; burn 3 is then excluded. The demo's
// correction set in force on OES-1 applies to the uploaded burns (α·x + β per element), so the
// expected results are computed here from that set with decimal.js, rounded half-even (ASTM E29).
const GOOD_CSV = [
  'Sample,Heat,Grade,Kind,Burn,C %,Mn %,S %',
  'K24-0950-F1,K24-0950,SAE 1045,final,1,0.452,0.75,0.012',
  'K24-0950-F1,K24-0950,SAE 1045,final,2,0.448,0.76,0.011',
  'K24-0950-F1,K24-0950,SAE 1045,final,3,0.470,0.71,0.012',
  'K24-0951-P1,K24-0951,SAE 1018,preliminary,1,0.17,0.80,0.009',
  'K24-0951-P1,K24-0951,SAE 1018,preliminary,2,0.18,0.81,0.010',
  '',
].join('\n');

let session: Awaited<ReturnType<typeof consoleSession>>;
let server: typeof session.server;
let page: Page;

beforeAll(async () => {
  session = await consoleSession(ANALYST, { importMaxBytes: LIMIT });
  ({ server, page } = session);
});
afterAll(() => session?.close());

const nav = (label: string) => page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: label, exact: true });
const count = async (table: string) => Number((await server.db(table).count({ n: '*' }))[0].n);
const countFigure = (label: string) => page.locator(`[data-count="${label}"]`).innerText();
const resultRow = (element: string) => page.locator(`[data-testid="result-row"][data-element="${element}"]`);

const D100 = Decimal.clone({ precision: 100 });
/** The reported mean of K24-0950-F1's corrected burns: α·x + β with the set the sample recorded, ×10^shift for ppm. */
async function reportedAfterCorrection(element: string, measured: string[], decimals: number, shift = 0): Promise<string> {
  const sample = await server.db('samples').where({ sample_code: 'K24-0950-F1' }).first();
  const [setId] = JSON.parse(sample.correction_json).set_ids;
  const sets = JSON.parse((await server.db('standardizations').where({ id: setId }).first()).corrections_json) as {
    element: string;
    slope: string;
    offset: string;
  }[];
  const c = sets.find((e) => e.element === element)!;
  const mean = measured
    .reduce((sum, x) => sum.plus(new D100(c.slope).times(x).plus(c.offset)), new D100(0))
    .div(measured.length)
    .times(new D100(10).pow(shift));
  // In ppm and ppb: whole units, or the method's step where that is finer (never the % rounding scaled).
  const places = Math.max(0, decimals - shift);
  return mean.toDecimalPlaces(places, Decimal.ROUND_HALF_EVEN).toFixed(places);
}

async function chooseLab() {
  await page.getByLabel('Instrument').selectOption({ label: 'OES-1 — Melt shop spark stand' });
  await page.getByLabel('Method').selectOption({ label: 'FE-LA — Low-alloy steel (Fe base)' });
}

describe('uploading results through the console', () => {
  it('previews a file, imports it and shows the report with its samples and raw file', async () => {
    await nav('Upload results').click();
    await page.getByRole('heading', { name: 'Upload results' }).waitFor();

    // Preview without choices says what is missing, beside each control.
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByText('Choose the instrument that measured these samples.').waitFor();
    await page.getByText('Choose or drop the result file.').waitFor();

    await chooseLab();
    await page.getByLabel('Result file').setInputFiles({ name: 'k24-0950.csv', mimeType: 'text/csv', buffer: Buffer.from(GOOD_CSV) });
    await page.getByRole('button', { name: 'Preview' }).click();
    const preview = page.getByTestId('import-preview');
    await preview.waitFor();
    expect(await countFigure('Samples')).toBe('2');
    expect(await countFigure('Burns')).toBe('5');
    expect(await countFigure('Values')).toBe('15');
    const mnColumn = await preview.getByTestId('column-row').filter({ hasText: 'Mn %' }).innerText();
    expect(mnColumn).toMatch(/Mn %\s+Element\s+Element Mn, in %\s+Detected from the header/);
    expect(await preview.getByTestId('preview-burn-row').count()).toBe(5);
    expect(await preview.getByText('These bytes were imported before').count()).toBe(0);
    expect(await count('samples')).toBe(170); // the preview stored nothing (26 demo heat and lot samples, 144 control points)

    // Mode is chosen with a plain explanation; the whole file or nothing is the default, and the
    // panel says what will happen to the lab's data.
    expect(await page.getByRole('radio', { name: /Whole file or nothing/ }).isChecked()).toBe(true);
    expect(await page.getByTestId('import-plan').innerText()).toMatch(
      /^2 samples \(5 burns, 15 values\) will be added to the lab's results\./,
    );
    await page.getByRole('button', { name: 'Import 2 samples' }).click();
    const report = page.getByTestId('import-report');
    await report.waitFor();
    await page.getByText('Imported: 2 samples created from k24-0950.csv').waitFor();
    expect(await countFigure('Samples created')).toBe('2');
    expect(await countFigure('Burns')).toBe('5');
    expect(await countFigure('Lines rejected')).toBe('0');
    expect(await count('samples')).toBe(172); // the demo's 170 and the 2 imported

    // The raw file comes back byte for byte, with the SHA-256 the report shows.
    const sha256 = createHash('sha256').update(GOOD_CSV).digest('hex');
    await report.getByText(sha256).waitFor();
    const href = await report.getByRole('link', { name: /Download the raw file/ }).getAttribute('href');
    const raw = await page.request.get(`${server.url}${href}`);
    expect(raw.status()).toBe(200);
    expect((await raw.body()).toString('utf8')).toBe(GOOD_CSV);

    // The created samples are listed and linked.
    const rows = page.getByTestId('sample-row');
    await rows.first().waitFor();
    expect((await rows.allInnerTexts()).map((text) => text.split(/\s/)[0]).sort()).toEqual(['K24-0950-F1', 'K24-0951-P1']);
  });

  it('opens a created sample, excludes a burn with a reason and shows the recomputed results', async () => {
    await page.getByRole('link', { name: 'K24-0950-F1' }).click();
    await page.getByRole('heading', { name: 'Sample K24-0950-F1' }).waitFor();
    await page.getByText('must be reviewed and authorised under your laboratory').waitFor();
    expect(await resultRow('Mn').getByTestId('reported').innerText()).toBe(
      await reportedAfterCorrection('Mn', ['0.75', '0.76', '0.71'], 2),
    );
    expect(await resultRow('Mn').getByTestId('n').innerText()).toBe('3');
    const provenance = await page.getByTestId('sample-provenance').innerText();
    expect(provenance).toContain('k24-0950.csv');
    expect(provenance).toContain(createHash('sha256').update(GOOD_CSV).digest('hex'));
    expect(provenance).toMatch(/File lines\s+2–4/);
    // The demo has a correction set in force on OES-1: the page names it and links its run.
    const correction = page.getByTestId('sample-correction');
    expect(await correction.innerText()).toMatch(
      /Drift correction: slope·x \+ offset applied to each burn's concentration, with std_\w+ — the set in force when each burn was measured\./,
    );
    // The raw value as received is on hover; the burns are shown drift-corrected, or as measured on request.
    const burn3 = page.locator('[data-testid="burn-row"][data-burn="3"]');
    await page.getByText('As measured', { exact: true }).click();
    expect(await burn3.locator('td[data-element="Mn"]').innerText()).toBe('0.7100');
    expect(await burn3.locator('td[data-element="Mn"]').getAttribute('title')).toBe('Full value: 0.71. As received: 0.71 %');

    await page.getByRole('button', { name: 'Exclude burn 3' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Exclude burn' }).click();
    await dialog.getByText(/Say why, in a few words/).waitFor();
    await dialog.getByLabel('Reason (required)').fill('Spark on a pore');
    await dialog.getByRole('button', { name: 'Exclude burn' }).click();
    await page.locator('[data-testid="burn-row"][data-burn="3"][data-excluded="true"]').waitFor();
    await dialog.waitFor({ state: 'hidden' });

    expect(await burn3.innerText()).toMatch(/✕ Excluded\s+“Spark on a pore” — omar\.reyes@kestrelbend\.test/);
    const struck = await burn3.locator('td[data-element="Mn"]').evaluate((el) => getComputedStyle(el).textDecorationLine);
    expect(struck).toBe('line-through');
    await page.waitForFunction(() => document.querySelector('[data-element="Mn"] [data-testid="n"]')?.textContent === '2');
    expect(await resultRow('Mn').getByTestId('reported').innerText()).toBe(await reportedAfterCorrection('Mn', ['0.75', '0.76'], 2));
    expect(await resultRow('C').getByTestId('reported').innerText()).toBe(await reportedAfterCorrection('C', ['0.452', '0.448'], 3));

    const audit = await server.db('audit_events').where({ action: 'sample.burn_excluded' }).first();
    expect(JSON.parse(audit.after_json)).toMatchObject({ reason: 'Spark on a pore' });

    // In ppm (1 % = 10 000 ppm, NIST SP 811), reported at whole ppm from the mean in ppm.
    // The unit switch is a radio group: arrow keys move from % to ppm.
    const ppm = await reportedAfterCorrection('Mn', ['0.75', '0.76'], 2, 4);
    await page.getByRole('radio', { name: '%' }).focus();
    await page.keyboard.press('ArrowRight');
    await page.waitForURL(/unit=ppm/);
    await page.waitForFunction(
      (expected) => document.querySelector('[data-element="Mn"] [data-testid="reported"]')?.textContent === expected,
      ppm,
    );
  });

  it('says readably, before anything is sent, why a burn cannot be excluded below two', async () => {
    await nav('Samples').click();
    await page.getByLabel('Heat').fill('K24-0951');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL(/heat=K24-0951/);
    await page.getByRole('link', { name: 'K24-0951-P1' }).click();
    await page.getByRole('button', { name: 'Exclude burn 1' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('This burn cannot be changed').waitFor();
    expect(await dialog.getByTestId('preview-refusal').innerText()).toBe(
      'Method FE-LA needs at least 2 included burns for a result, and this would leave 1. Spark the sample again (or include another burn first), then exclude this one.',
    );
    expect(await dialog.getByRole('button', { name: 'Exclude burn' }).isDisabled()).toBe(true);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.locator('[data-testid="burn-row"][data-burn="1"]').getAttribute('data-excluded')).toBe('false');

    // Including a burn again asks for a reason too, and says so on the burn (K24-0950-F1's burn 3, excluded above).
    await page.goto(`${server.url}/samples?heat=K24-0950`);
    await page.getByRole('link', { name: 'K24-0950-F1' }).click();
    await page.getByRole('button', { name: 'Include burn 3' }).click();
    await dialog.getByLabel('Reason (required)').fill('Checked the burn mark again: fine');
    await dialog.getByRole('button', { name: 'Include burn' }).click();
    await page.locator('[data-testid="burn-row"][data-burn="3"][data-excluded="false"]').waitFor();
    expect(await page.locator('[data-testid="burn-row"][data-burn="3"]').innerText()).toContain(
      'Included again: “Checked the burn mark again: fine”',
    );
  });

  it('recognises the same bytes uploaded again and creates nothing', async () => {
    await nav('Upload results').click();
    await chooseLab();
    await page.getByLabel('Result file').setInputFiles({ name: 'again.csv', mimeType: 'text/csv', buffer: Buffer.from(GOOD_CSV) });
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByText('These bytes were imported before').waitFor();
    const before = await count('samples');
    await page.getByRole('button', { name: 'Show the earlier import' }).click();
    await page.getByText('These bytes were imported before: nothing new was created').waitFor();
    expect(await page.getByTestId('import-report').innerText()).toContain('k24-0950.csv');
    expect(await count('samples')).toBe(before);
  });
});

describe('files the console refuses', () => {
  it('lists the line and column of a broken value, says the whole file would be refused, and stores nothing; the file is chosen with the keyboard', async () => {
    await nav('Upload results').click();
    await chooseLab();
    const broken = GOOD_CSV.replace(/K24-095/g, 'K24-096').replace('0.76', '0.7.6');
    // Tab from the profile select reaches the file input; Space opens the file chooser.
    await page.getByLabel('Import profile (optional)').focus();
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.type)).toBe('file');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.keyboard.press('Space')]);
    await chooser.setFiles({ name: 'broken.csv', mimeType: 'text/csv', buffer: Buffer.from(broken) });
    await page.getByText('broken.csv').waitFor();
    const before = await count('samples');
    await page.getByRole('button', { name: 'Preview' }).click();
    const rejected = page.getByTestId('preview-rejected');
    await rejected.waitFor();
    expect(await rejected.getByTestId('issue-row').innerText()).toMatch(/^3\s+Mn %\s+.*"0\.7\.6"/);
    // The whole file would be refused: the panel says so and offers no import that stores nothing.
    await page.getByText('This file would be refused whole').waitFor();
    expect(await page.getByTestId('import-plan').innerText()).toContain('1 line cannot be read');
    expect(await page.getByRole('button', { name: 'Import the whole file' }).isDisabled()).toBe(true);
    // Sample by sample says which part would be stored; back to the whole file, nothing is sent.
    await page.getByRole('radio', { name: /Sample by sample/ }).check();
    expect(await page.getByRole('button', { name: 'Import 1 sample, leave out 1 sample' }).isEnabled()).toBe(true);
    await page.getByRole('radio', { name: /Whole file or nothing/ }).check();
    expect(await count('samples')).toBe(before);
  });

  it('says a file cannot be read at all when its columns make no sense', async () => {
    await page.getByRole('button', { name: 'Choose another file', exact: true }).click();
    await chooseLab();
    await page
      .getByLabel('Result file')
      .setInputFiles({ name: 'two-mn.csv', mimeType: 'text/csv', buffer: Buffer.from('Sample,Mn %,Mn %\nK24-0970-F1,0.75,0.76\n') });
    await page.getByRole('button', { name: 'Preview' }).click();
    const problem = page.getByTestId('import-problem');
    await problem.waitFor();
    expect(await problem.getByText(/^\W*The file cannot be read$/).count()).toBe(1);
    expect(await problem.getByTestId('issue-row').first().innerText()).toMatch(/^1\s+Mn %/);
  });

  it('states the size limit in words for a file that is too large (413)', async () => {
    const big = `${GOOD_CSV}${'K24-0980-F1,K24-0980,SAE 1045,final,1,0.452,0.75,0.012\n'.repeat(1200)}`;
    expect(big.length).toBe(66_326); // 64.77 KiB
    await page.getByLabel('Result file').setInputFiles({ name: 'big.csv', mimeType: 'text/csv', buffer: Buffer.from(big) });
    await page.getByRole('button', { name: 'Preview' }).click();
    const message = page.getByTestId('too-large');
    await message.waitFor();
    expect(await message.innerText()).toContain('The server accepts files of at most 48.8 KiB (50,000 bytes). This file is 64.8 KiB.');
  });
});

describe('upload progress', () => {
  it('shows how much of the file is sent, measured in bytes, while the upload runs', async () => {
    await nav('Imports').click();
    await page.getByRole('link', { name: 'Upload results' }).first().click();
    await chooseLab();
    const lines = Array.from(
      { length: 700 },
      (_, i) => `K24-0990-F${Math.floor(i / 3) + 1},K24-0990,SAE 1045,final,${(i % 3) + 1},0.452,0.75,0.012`,
    );
    const file = ['Sample,Heat,Grade,Kind,Burn,C %,Mn %,S %', ...lines, ''].join('\n');
    expect(file.length).toBeLessThan(LIMIT);
    await page.getByLabel('Result file').setInputFiles({ name: 'k24-0990.csv', mimeType: 'text/csv', buffer: Buffer.from(file) });
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByTestId('import-preview').waitFor();

    // Slow the upload down (Chrome's network emulation, ~16 KB/s) so the bar can be watched.
    const cdp = await page.context().newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: 16_000 });
    await page.getByRole('button', { name: /^Import \d+ samples$/ }).click();
    const bar = page.getByRole('progressbar', { name: 'Uploading' });
    await bar.waitFor();
    const seen = new Set<number>();
    while (!(await page.getByTestId('import-report').isVisible())) {
      const now = await bar.getAttribute('aria-valuenow', { timeout: 200 }).catch(() => null);
      if (now) seen.add(Number(now));
      await page.waitForTimeout(100);
    }
    await cdp.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });
    expect([...seen].some((percent) => percent > 0 && percent < 100)).toBe(true);
    expect(await countFigure('Samples created')).toBe('234');
  });
});
