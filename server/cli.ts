// Bootstrap commands: `npm run cli -- <command> [options]`.
import { parseArgs } from 'node:util';
import { forgetSessionSecret } from './cluster/session-secret.ts';
import { ConfigError, loadConfig } from './config.ts';
import { createDb, type Db } from './db/knex.ts';
import { migrateLatest } from './db/migrate.ts';
import { createApiKey } from './domain/api-keys/api-keys.service.ts';
import { sessionAuthContext } from './domain/auth/auth.service.ts';
import { isScope, type Scope } from './domain/auth/scopes.ts';
import { PasswordSchema } from './domain/users/users.schemas.ts';
import { ensureAdmin } from './domain/users/users.service.ts';
import { findFirstActiveAdmin, findUserByEmail, type UserRow } from './domain/users/users.repository.ts';
import { createLogger } from './logger.ts';
import { createImportWorkers } from './domain/imports/import-workers.ts';
import { createMailer } from './mail/mailer.ts';

const USAGE = `Usage: npm run cli -- <command> [options]

Commands:
  migrate                                   apply pending database migrations
  create-admin --email E --password P [--name N]
                                            create an active admin, or make E an active admin with password P
  create-key --name N --scopes a,b [--owner E] [--expires-at ISO]
                                            issue an API key owned by admin E (default: the first admin);
                                            the secret is printed as the last line
  forget-session-secret                     before giving every node a new SESSION_SECRET on purpose: the next
                                            node to start records the new one (everyone is signed out)`;

class UsageError extends Error {}

function required(values: Record<string, string | undefined>, name: string): string {
  const value = values[name];
  if (!value) throw new UsageError(`--${name} is required`);
  return value;
}

async function findOwner(db: Db, email?: string): Promise<UserRow> {
  const owner = email ? await findUserByEmail(db, email) : await findFirstActiveAdmin(db);
  if (!owner || owner.status !== 'active')
    throw new UsageError(email ? `no active user ${email}` : 'no active admin yet: run create-admin first');
  return owner;
}

async function run(argv: string[]): Promise<void> {
  const [command, ...rest] = argv;
  const { values } = parseArgs({
    args: rest,
    options: {
      email: { type: 'string' },
      password: { type: 'string' },
      name: { type: 'string' },
      scopes: { type: 'string' },
      owner: { type: 'string' },
      'expires-at': { type: 'string' },
    },
    strict: true,
  });
  if (!command || command === 'help' || command === '--help') {
    console.log(USAGE);
    return;
  }
  const config = loadConfig();
  const db = createDb(config);
  try {
    await migrateLatest(db);
    if (command === 'migrate') {
      console.log('database is up to date');
    } else if (command === 'create-admin') {
      const email = required(values, 'email');
      const password = PasswordSchema.safeParse(required(values, 'password'));
      if (!password.success) throw new UsageError(`--password ${password.error.issues[0].message}`);
      const { user, created } = await ensureAdmin({ db }, email, password.data, values.name);
      console.log(`${created ? 'created' : 'updated'} admin ${user.email} (${user.id})`);
    } else if (command === 'create-key') {
      const name = required(values, 'name');
      const scopes = required(values, 'scopes')
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean);
      const unknown = scopes.filter((s) => !isScope(s));
      if (unknown.length) throw new UsageError(`unknown scopes: ${unknown.join(', ')}`);
      const owner = await findOwner(db, values.owner);
      const logger = createLogger('silent');
      // The import workers start only when an import runs; issuing a key runs none.
      const ctx = { db, config, logger, mailer: createMailer({ from: config.mailFrom, logger }), importWorkers: createImportWorkers() };
      const key = await createApiKey(ctx, sessionAuthContext(owner, 'cli'), {
        name,
        scopes: scopes as Scope[],
        expires_at: values['expires-at'],
      });
      console.log(`issued key ${key.id} (${key.prefix}…) for ${owner.email} with scopes ${key.scopes.join(',')}`);
      console.log(key.secret);
    } else if (command === 'forget-session-secret') {
      await forgetSessionSecret(db);
      console.log('the SESSION_SECRET fingerprint is forgotten: start every node with the same new secret');
    } else {
      throw new UsageError(`unknown command "${command}"`);
    }
  } finally {
    await db.destroy();
  }
}

run(process.argv.slice(2)).catch((error: unknown) => {
  if (error instanceof UsageError) console.error(`error: ${error.message}\n\n${USAGE}`);
  else if (error instanceof ConfigError) console.error(error.message);
  else if (error instanceof Error && 'code' in error && error.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION')
    console.error(`error: ${error.message}\n\n${USAGE}`);
  else console.error(error);
  process.exit(1);
});
