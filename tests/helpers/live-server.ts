// The real app with the built console, listening on a free port, on a SQLite file seeded
// with the demo scenario — what `npm start` serves, minus the build step. API-only callers
// (the example scripts) pass { console: false } and need no build. A test that restarts the
// server passes its own `databaseFile` (kept after stop) and a fixed `port`.
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createApp, DEFAULT_CONSOLE_DIR } from '../../server/app.ts';
import { testConfig, type Config } from '../../server/config.ts';
import { createDb } from '../../server/db/knex.ts';
import { migrateLatest } from '../../server/db/migrate.ts';
import { listen } from '../../server/index.ts';
import { createLogger } from '../../server/logger.ts';
import { startFakeSmtp } from '../../server/mail/fake-smtp.ts';
import { seedDemoIfEmpty } from '../../server/seed/demo.ts';

export async function startLiveServer(
  options: { console?: boolean; config?: Partial<Config>; validateResponses?: boolean; databaseFile?: string; port?: number } = {},
) {
  const withConsole = options.console ?? true;
  if (withConsole && !existsSync(join(DEFAULT_CONSOLE_DIR, 'index.html')))
    throw new Error('dist/ is missing: run `npm run build` first (npm test does)');
  const dir = options.databaseFile ? undefined : mkdtempSync(join(tmpdir(), 'meltwire-live-'));
  const smtp = await startFakeSmtp();
  const config = testConfig({ databaseFile: options.databaseFile ?? join(dir!, 'live.db'), smtpUrl: smtp.url, ...options.config });
  const db = createDb(config);
  await migrateLatest(db);
  await seedDemoIfEmpty(db);
  const logger = createLogger('silent');
  // Responses are checked against the OpenAPI document here too (see tests/helpers/test-app.ts),
  // unless a benchmark turns that off to measure the server as served.
  const app = createApp({
    db,
    config,
    logger,
    outbox: smtp.outbox,
    validateResponses: options.validateResponses ?? true,
    ...(withConsole ? {} : { consoleDir: '/nonexistent' }),
  });
  const running = await listen(app, db, logger, options.port ?? 0, () => smtp.close(), config.host);
  return {
    url: running.url,
    db,
    ctx: app.locals.ctx,
    async stop() {
      await running.stop();
      if (dir) rmSync(dir, { recursive: true, force: true });
    },
  };
}
