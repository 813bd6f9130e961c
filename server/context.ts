import type { Logger } from 'pino';
import type { Config } from './config.ts';
import type { Db } from './db/knex.ts';
import type { Outbox } from './mail/fake-smtp.ts';
import type { Mailer } from './mail/mailer.ts';

/** What every route handler and service can reach. Built once per app by createApp(). */
export interface AppContext {
  db: Db;
  config: Config;
  logger: Logger;
  mailer: Mailer;
  /** Present when the in-process SMTP server captures mail (development and tests). */
  outbox?: Outbox;
}
