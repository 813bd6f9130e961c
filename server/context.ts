import type { Logger } from 'pino';
import type { Config } from './config.ts';
import type { Db } from './db/knex.ts';
import type { ImportWorkers } from './domain/imports/import-workers.ts';
import type { Outbox } from './mail/fake-smtp.ts';
import type { Mailer } from './mail/mailer.ts';

/** What every route handler and service can reach. Built once per app by createApp(). */
export interface AppContext {
  db: Db;
  config: Config;
  logger: Logger;
  mailer: Mailer;
  /** Worker threads that read imported files; started on first use, stopped with the server. */
  importWorkers: ImportWorkers;
  /** Present when the in-process SMTP server captures mail (development and tests). */
  outbox?: Outbox;
  /** Tests only: every JSON answer is checked against the OpenAPI document (createApp's validateResponses). */
  checksResponses?: boolean;
}
