// Browser journeys are checked at the two widths the lab uses: a 1024 px tablet on the melt-shop
// floor and a 1440 px desk screen. Each step can leave a screenshot in test-results/screenshots/
// (kept by CI as a test artefact, ignored by git).
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';

export const JOURNEY_WIDTHS = [1024, 1440] as const;
export type JourneyWidth = (typeof JOURNEY_WIDTHS)[number];

const SCREENSHOT_DIR = join(process.cwd(), 'test-results', 'screenshots');

/** Resizes the page to a journey width (height 800 px, a common tablet/laptop landscape height). */
export async function useWidth(page: Page, width: JourneyWidth): Promise<void> {
  await page.setViewportSize({ width, height: 800 });
}

/** Saves a full-page screenshot named `<journey>-<step>-<width>.png` and returns its path. */
export async function saveScreen(page: Page, journey: string, step: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const width = page.viewportSize()?.width ?? 0;
  const path = join(SCREENSHOT_DIR, `${journey}-${step}-${width}.png`);
  await page.screenshot({ path, fullPage: true });
  return path;
}

/** True when the page scrolls sideways: the document is wider than the window. */
export async function scrollsSideways(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > window.innerWidth + 1);
}
