// The console handles a big file: a generated 20,000-burn wide file (3 burns per sample,
// 25 elements; bench/generate-wide-file.ts) is previewed and imported through the upload page.
// The timings are printed so they can be compared between runs (the machine is noisy).
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { WIDE_FILE_ELEMENTS, wideCsv } from '../../bench/generate-wide-file.ts';
import { consoleSession } from '../helpers/console-session.ts';

const BURNS = 20_000;
const PER_SAMPLE = 3; // wideCsv's default

let session: Awaited<ReturnType<typeof consoleSession>>;
let server: typeof session.server;
let page: Page;

beforeAll(async () => {
  session = await consoleSession('omar.reyes@kestrelbend.test');
  ({ server, page } = session);
});
afterAll(() => session?.close());

const countFigure = (label: string) => page.locator(`[data-count="${label}"]`).innerText();
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`; // a duration for the log, not a chemistry value

describe('a 20,000-burn file through the console', () => {
  it('previews and imports it, and reports every sample, burn and value', { timeout: 300_000 }, async () => {
    const text = wideCsv(BURNS);
    const samples = Math.ceil(BURNS / PER_SAMPLE);
    const values = BURNS * WIDE_FILE_ELEMENTS.length;
    await page.goto(`${server.url}/imports/new`);
    await page.getByLabel('Instrument').selectOption({ label: 'OES-1 — Melt shop spark stand' });
    await page.getByLabel('Method').selectOption({ label: 'FE-LA — Low-alloy steel (Fe base)' });
    await page.getByLabel('Result file').setInputFiles({ name: 'wide-20000.csv', mimeType: 'text/csv', buffer: Buffer.from(text) });

    const previewStart = Date.now();
    await page.getByRole('button', { name: 'Preview' }).click();
    await page.getByTestId('import-preview').waitFor({ timeout: 120_000 });
    const previewMs = Date.now() - previewStart;
    expect(await countFigure('Samples')).toBe(samples.toLocaleString('en'));
    expect(await countFigure('Burns')).toBe(BURNS.toLocaleString('en'));
    expect(await countFigure('Values')).toBe(values.toLocaleString('en'));

    // Fe is the balance on this steel method: the import waits until someone decides. It is kept
    // (the generator writes it as a value) and the choice saved in a new import profile.
    const fe = page.locator('[data-testid="column-decision"][data-header="Fe %"]');
    await fe.getByRole('radio', { name: /Keep it as read/ }).check();
    await page.getByRole('button', { name: 'Save the choices as a new profile' }).click();
    await page.getByTestId('column-decisions').waitFor({ state: 'detached', timeout: 120_000 });
    await page.getByTestId('import-preview').waitFor({ timeout: 120_000 });
    expect(await countFigure('Values')).toBe(values.toLocaleString('en'));

    const importStart = Date.now();
    // The progress bar is checked in ingest-console.test.ts with a throttled upload: here the server
    // runs in this test's process and keeps its event loop busy while it stores the file.
    await page.getByRole('button', { name: `Import ${samples.toLocaleString('en')} samples` }).click();
    await page.getByTestId('import-report').waitFor({ timeout: 240_000 });
    const importMs = Date.now() - importStart;
    expect(await countFigure('Samples created')).toBe(samples.toLocaleString('en'));
    expect(await countFigure('Burns')).toBe(BURNS.toLocaleString('en'));
    expect(await countFigure('Values')).toBe(values.toLocaleString('en'));
    expect(await countFigure('Lines rejected')).toBe('0');
    await page.getByTestId('sample-row').first().waitFor();

    const stored = await server
      .db('burns')
      .join('samples', 'samples.id', 'burns.sample_id')
      .whereNotNull('samples.import_id')
      .count({ n: '*' });
    expect(Number(stored[0].n)).toBe(BURNS);
    console.log(
      `20,000-burn console upload (${(Buffer.byteLength(text) / 1024 / 1024).toFixed(1)} MiB): preview ${seconds(previewMs)}, import ${seconds(importMs)} (upload, store, report shown)`,
    );
  });
});
