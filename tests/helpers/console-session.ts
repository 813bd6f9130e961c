// A live server with the built console, a browser page on it, and a demo user signed in there.
import type { Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import type { Config } from '../../server/config.ts';
import { DEMO_PASSWORD } from '../../server/seed/demo-users.ts';
import { launchBrowser } from './browser.ts';
import { startLiveServer } from './live-server.ts';

export async function consoleSession(email: string, config?: Partial<Config>) {
  const server = await startLiveServer({ config });
  const browser = await launchBrowser();
  const page: Page = await browser.context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: /^Welcome, / }).waitFor();
  return {
    server,
    page,
    async close() {
      await browser.close();
      await server.stop();
    },
  };
}

export type ConsoleSession = Awaited<ReturnType<typeof consoleSession>>;

/** For one test file: a console session of `email`, opened before its tests and closed after them. */
export function useConsoleSession(email: string, config?: Partial<Config>): ConsoleSession {
  const state = {} as ConsoleSession;
  beforeAll(async () => {
    Object.assign(state, await consoleSession(email, config));
  });
  afterAll(() => state.close?.());
  return state;
}
