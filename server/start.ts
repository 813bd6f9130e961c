// `npm start`: build the console if needed, migrate, seed the demo on an empty database,
// capture mail in-process when no SMTP server is configured, then serve API and console.
// `npm run dev` starts this with `--dev` under `tsx watch`: no console build, because Vite
// serves the console with hot reload and forwards /api here.
import { createApp, DEFAULT_CONSOLE_DIR } from './app.ts';
import { checkSessionSecret } from './cluster/session-secret.ts';
import { withStartupLock } from './cluster/startup-lock.ts';
import { ConfigError, loadConfig } from './config.ts';
import { buildConsole, consoleNeedsBuild } from './console-build.ts';
import { createDb } from './db/knex.ts';
import { migrateLatest } from './db/migrate.ts';
import { recorderFor } from './domain/request-log/recorder.ts';
import { startDeliveryWorker } from './domain/webhooks/delivery-worker.ts';
import { startHousekeeping } from './housekeeping.ts';
import { startAlertFlusher } from './domain/alerts/alerts.service.ts';
import { startFeedWatch } from './domain/feeds/feed-watch.ts';
import { listen, stopOnSignals } from './index.ts';
import { createLogger } from './logger.ts';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp.ts';
import { demoAdminStillDefault, DEMO_PASSWORD, DEMO_USERS } from './seed/demo-users.ts';
import { prepareStaleDocuments } from './domain/samples/prepared-documents.ts';
import { seedDemoIfEmpty } from './seed/demo.ts';

const DEV = process.argv.includes('--dev');

async function main(): Promise<void> {
  const config = loadConfig();
  const logger = createLogger(config.logLevel);
  if (!DEV && config.env !== 'production' && consoleNeedsBuild(DEFAULT_CONSOLE_DIR)) {
    logger.info('building the console (dist/ is missing or older than src/)');
    await buildConsole();
  }
  if (config.databaseUrl && !config.sessionSecretConfigured) {
    throw new ConfigError(['SESSION_SECRET: required with DATABASE_URL (32+ characters), the same on every node of the database']);
  }
  const db = createDb(config);
  // Several nodes starting at once migrate and seed one after the other (cluster/startup-lock.ts).
  await withStartupLock(db, async () => {
    const applied = await migrateLatest(db);
    if (applied.length > 0) logger.info({ migrations: applied }, 'database migrated');
    if (config.sessionSecretConfigured) await checkSessionSecret(db, config.sessionSecret);
    if (config.seedDemo && (await seedDemoIfEmpty(db))) logger.info('demo data seeded (Kestrel Bend Metals, invented)');
  });

  let smtp: FakeSmtp | undefined;
  if (!config.smtpUrl && config.env !== 'production') {
    smtp = await startFakeSmtp();
    config.smtpUrl = smtp.url;
    logger.info({ smtp: smtp.url }, "no SMTP_URL: e-mail is captured in-process and shown on the console's outbox page");
  }
  const app = createApp({ db, config, logger, outbox: smtp?.outbox });
  const housekeeping = startHousekeeping(app.locals.ctx);
  const webhooks = startDeliveryWorker(app.locals.ctx, { perEndpoint: config.webhookInFlightPerEndpoint });
  const alerts = startAlertFlusher(app.locals.ctx);
  const feedWatch = startFeedWatch(app.locals.ctx);
  const running = await listen(
    app,
    db,
    logger,
    config.port,
    async () => {
      // Attempts in flight are abandoned and sent again at the next start (same webhook-id).
      await webhooks.stop();
      await housekeeping.stop();
      await alerts.stop();
      await feedWatch.stop();
      // The last answered calls may still be writing their request log entries.
      await recorderFor(app.locals.ctx).drain();
      await smtp?.close();
    },
    config.host,
  );
  stopOnSignals(running, logger);
  // Samples stored before prepared documents existed, or under another representation version.
  prepareStaleDocuments(db).then(
    (count) => count > 0 && logger.info({ samples: count }, 'prepared documents made for reading'),
    (error: unknown) => logger.warn({ err: error }, 'preparing documents for reading failed; those samples are computed on each read'),
  );

  const lines = [
    `Meltwire ${config.version} is serving API and console on ${config.publicUrl} (listening on ${config.host}:${config.port}${config.host === '127.0.0.1' ? ', this machine only: set HOST=0.0.0.0 to open it to the network' : ''})`,
    `  API reference: ${config.publicUrl}/api/v1/openapi.json`,
  ];
  if (DEV) lines.push('  Console with hot reload: http://localhost:5173 (Vite, forwarding /api here)');
  if (config.seedDemo && (await demoAdminStillDefault(db))) {
    lines.push(`  Demo admin: ${DEMO_USERS[0].email} / ${DEMO_PASSWORD}  (demo data is invented; change this password before real use)`);
  }
  console.log(lines.join('\n'));
}

main().catch((error: unknown) => {
  if (error instanceof ConfigError) {
    console.error(error.message);
  } else {
    console.error('Meltwire failed to start:', error);
  }
  process.exit(1);
});
