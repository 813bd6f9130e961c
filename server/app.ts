// createApp({ db, config }) builds the whole HTTP application without listening, so tests can
// drive it with supertest and index.ts can serve it.
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import cookieParser from 'cookie-parser';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Config } from './config.ts';
import type { AppContext } from './context.ts';
import type { Db } from './db/knex.ts';
import { createImportWorkers, type ImportWorkers } from './domain/imports/import-workers.ts';
import { authenticate } from './http/authenticate.ts';
import { crossSiteGuard } from './http/cross-site.ts';
import { logSerializers } from './http/log-serializers.ts';
import { errorHandler, notFoundHandler } from './http/error-handler.ts';
import { jsonBody } from './http/json-body.ts';
import { apiLimiter } from './http/rate-limit.ts';
import { requestId } from './http/request-id.ts';
import { requestLog } from './http/request-log.ts';
import { responseValidation } from './http/response-validation.ts';
import { problemPages } from './http/problem-pages.ts';
import { type AnyRoute, mountRoutes } from './http/route.ts';
import { createLogger } from './logger.ts';
import type { Outbox } from './mail/fake-smtp.ts';
import { createMailer, type Mailer } from './mail/mailer.ts';
import { v1Routes } from './routes/v1/index.ts';

export interface AppOptions {
  db: Db;
  config: Config;
  logger?: Logger;
  mailer?: Mailer;
  outbox?: Outbox;
  /** Default: a pool of import workers of its own (createImportWorkers). */
  importWorkers?: ImportWorkers;
  /** Folder of the built console; served with a single-page fallback when it exists. */
  consoleDir?: string;
  /**
   * Tests only: check every JSON response against the OpenAPI document (express-openapi-validator,
   * a devDependency); a mismatch answers 500 naming it.
   */
  validateResponses?: boolean;
  /** Tests only: the /api/v1 operations to serve (default: all of them). */
  routes?: AnyRoute[];
}

/** API answers are never kept by browsers or proxies: they carry results, identities and, once, secrets. */
const noStore: express.RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};

export const DEFAULT_CONSOLE_DIR = resolve(import.meta.dirname, '../dist');

export function createApp(options: AppOptions): Express & { locals: { ctx: AppContext } } {
  const { db, config } = options;
  const logger = options.logger ?? createLogger(config.logLevel);
  const mailer = options.mailer ?? createMailer({ smtpUrl: config.smtpUrl, from: config.mailFrom, logger });
  const importWorkers = options.importWorkers ?? createImportWorkers();
  const ctx: AppContext = { db, config, logger, mailer, importWorkers, outbox: options.outbox, checksResponses: options.validateResponses };

  const app = express();
  app.locals.ctx = ctx;
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.use(requestId());
  app.use(
    pinoHttp({
      logger,
      genReqId: (req) => (req as express.Request).requestId,
      serializers: logSerializers,
      autoLogging: { ignore: (req) => req.url === '/api/v1/health' },
    }),
  );
  const https = config.publicUrl.startsWith('https://');
  app.use(
    helmet({
      strictTransportSecurity: https,
      contentSecurityPolicy: {
        directives: {
          // Over plain http (local use) upgrading would break every asset request.
          'upgrade-insecure-requests': https ? [] : null,
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'script-src': ["'self'"],
          'connect-src': ["'self'"],
          'font-src': ["'self'", 'data:'],
        },
      },
    }),
  );

  // gzip or br for JSON, CSV and the console's assets above 1 KB when the client accepts it. Mounted
  // before the request log, so the log and replays see the uncompressed body.
  app.use(compression({ threshold: 1024 }));

  const routes = options.routes ?? v1Routes;
  const api = express.Router();
  // First, so that calls refused by body parsing, authentication or rate limits are logged too.
  api.use(requestLog(ctx));
  api.use(noStore);
  if (options.validateResponses) api.use(responseValidation(routes));
  api.use(jsonBody(config.bodyLimit));
  api.use(cookieParser());
  api.use(crossSiteGuard(config));
  api.use(authenticate(ctx));
  api.use(apiLimiter(ctx));
  mountRoutes(api, routes, ctx);
  api.use(notFoundHandler());
  app.use('/api/v1', api);
  app.use('/api', notFoundHandler());
  // Each problem type URI opens a page that explains it (before the console, which would 404 it).
  app.use('/problems', problemPages());

  const consoleDir = options.consoleDir ?? DEFAULT_CONSOLE_DIR;
  if (existsSync(resolve(consoleDir, 'index.html'))) {
    app.use(express.static(consoleDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(resolve(consoleDir, 'index.html'));
    });
  }
  app.use(notFoundHandler());
  app.use(errorHandler(logger, config.bodyLimit));
  return app as Express & { locals: { ctx: AppContext } };
}
