// Environment → validated configuration. Fails fast with one readable message per bad variable.
import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import packageJson from '../package.json' with { type: 'json' };

const booleanFlag = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((value) => value === 'true' || value === '1' || value === 'yes');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z
    .string()
    .regex(
      /^(\d{1,3}(\.\d{1,3}){3}|[0-9a-fA-F:]*:[0-9a-fA-F:.]*|[A-Za-z0-9]([A-Za-z0-9.-]*[A-Za-z0-9])?)$/,
      'must be an IP address or host name to listen on, e.g. 127.0.0.1 (this machine only) or 0.0.0.0 (every interface)',
    )
    .optional(),
  DATABASE_FILE: z.string().min(1).default('./data/meltwire.db'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'must be a postgres:// or postgresql:// URL')
    .optional(),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  SESSION_TTL_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL')
    .optional(),
  MAIL_FROM: z.string().min(3).default('Meltwire <no-reply@meltwire.test>'),
  PUBLIC_URL: z.url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: booleanFlag.optional(),
  LOGIN_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(10),
  RATE_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).default(600),
  IMPORT_MAX_BYTES: z.coerce
    .number()
    .int()
    .min(1024)
    .default(20 * 1024 * 1024),
  BODY_LIMIT: z
    .string()
    .regex(/^\d+(b|kb|mb)$/i, 'must look like 512kb or 1mb')
    .default('1mb'),
  REQUEST_LOG_BODY_LIMIT: z.coerce
    .number()
    .int()
    .min(256)
    .max(1024 * 1024)
    .default(16384),
  REQUEST_LOG_RETENTION_DAYS: z.coerce.number().int().min(1).max(3650).default(30),
  RELEASE_REQUIRES_SECOND_PERSON: booleanFlag.default(true),
  EVENT_RETENTION_DAYS: z.coerce.number().int().min(1).max(3650).default(30),
  AGENT_STALE_MINUTES: z.coerce.number().int().min(1).max(10080).default(15),
  ALERT_GROUP_MINUTES: z.coerce
    .number()
    .min(0)
    .max(24 * 60)
    .default(5),
  WEBHOOK_ALLOW_PRIVATE: booleanFlag.optional(),
  WEBHOOK_RETRY_DELAYS: z
    .string()
    .regex(/^\s*\d+(\s*,\s*\d+){0,19}\s*$/, 'must be 1–20 comma-separated whole numbers of seconds, e.g. 0,5,300')
    .default('0,5,300,1800,7200,18000,36000,36000'),
  WEBHOOK_IN_FLIGHT_PER_ENDPOINT: z.coerce.number().int().min(1).max(128).default(16),
  TRUST_PROXY: z
    .string()
    .regex(
      /^(true|false|\d+|[\w.:/, -]+)$/,
      'must be false, true, a number of proxy hops, or addresses/subnets such as loopback or 10.0.0.0/8',
    )
    .default('false'),
});

/** Express's `trust proxy`: off unless the operator says which proxies may set X-Forwarded-For. */
function trustProxy(value: string): boolean | number | string {
  if (value === 'false') return false;
  if (value === 'true') return true;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}

export interface Config {
  env: 'development' | 'production' | 'test';
  port: number;
  /** The address the server listens on: 127.0.0.1 (this machine only) unless HOST says otherwise; 0.0.0.0 by default in production. */
  host: string;
  databaseFile: string;
  databaseUrl?: string;
  sessionSecret: string;
  /** SESSION_SECRET was given (not drawn at random for this process). */
  sessionSecretConfigured: boolean;
  sessionTtlMinutes: number;
  smtpUrl?: string;
  mailFrom: string;
  publicUrl: string;
  logLevel: string;
  seedDemo: boolean;
  loginRateLimitPerMinute: number;
  rateLimitPerMinute: number;
  bodyLimit: string;
  importMaxBytes: number;
  /** Bytes of each request and response body kept in the request log. */
  requestLogBodyLimit: number;
  requestLogRetentionDays: number;
  /** The person who releases a sample must not be the one who created it or last changed its burns. */
  releaseRequiresSecondPerson: boolean;
  /** Events (the change feed) and their webhook deliveries older than this are deleted. */
  eventRetentionDays: number;
  /** E-mail alerts for one user within this many minutes are sent as one message. */
  alertGroupMinutes: number;
  /** Lets webhook endpoints be plain http and resolve to loopback or private addresses (demo, tests). */
  webhookAllowPrivate: boolean;
  /** Seconds before each delivery attempt, the first counted from the event: one entry per attempt. */
  webhookRetryDelays: number[];
  /** Delivery attempts in flight at once to one endpoint; 1 delivers in feed order (while none is retried). */
  webhookInFlightPerEndpoint: number;
  /** An instrument agent silent for longer than this shows its feed as stale. */
  agentStaleMinutes: number;
  /** Which proxies' X-Forwarded-For is believed for the client address (rate limits, logs). */
  trustProxy: boolean | number | string;
  version: string;
}

export class ConfigError extends Error {
  constructor(public readonly problems: string[]) {
    super(`Invalid configuration:\n${problems.map((p) => `  - ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

export const APP_VERSION: string = packageJson.version;

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const present = Object.fromEntries(Object.entries(env).filter(([, value]) => value !== ''));
  const parsed = envSchema.safeParse(present);
  if (!parsed.success) {
    throw new ConfigError(parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`));
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && !e.SESSION_SECRET) {
    throw new ConfigError(['SESSION_SECRET: required when NODE_ENV=production (32+ characters)']);
  }
  const seedDemo = e.SEED_DEMO ?? e.NODE_ENV !== 'production';
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    // A demo or development server is reachable from this machine only unless HOST opens it;
    // production (typically behind a proxy or in a container) listens on every interface.
    host: e.HOST ?? (e.NODE_ENV === 'production' ? '0.0.0.0' : '127.0.0.1'),
    databaseFile: e.DATABASE_FILE,
    databaseUrl: e.DATABASE_URL,
    // Without a configured secret, sessions last until the process restarts (development only).
    sessionSecret: e.SESSION_SECRET ?? randomBytes(32).toString('hex'),
    sessionSecretConfigured: e.SESSION_SECRET !== undefined,
    sessionTtlMinutes: e.SESSION_TTL_MINUTES,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    publicUrl: (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    logLevel: e.LOG_LEVEL,
    seedDemo,
    loginRateLimitPerMinute: e.LOGIN_RATE_LIMIT_PER_MINUTE,
    rateLimitPerMinute: e.RATE_LIMIT_PER_MINUTE,
    bodyLimit: e.BODY_LIMIT,
    importMaxBytes: e.IMPORT_MAX_BYTES,
    requestLogBodyLimit: e.REQUEST_LOG_BODY_LIMIT,
    requestLogRetentionDays: e.REQUEST_LOG_RETENTION_DAYS,
    eventRetentionDays: e.EVENT_RETENTION_DAYS,
    alertGroupMinutes: e.ALERT_GROUP_MINUTES,
    // The demo points webhooks at a receiver on the same machine; production never opens private addresses by default.
    webhookAllowPrivate: e.WEBHOOK_ALLOW_PRIVATE ?? (seedDemo && e.NODE_ENV === 'development'),
    webhookRetryDelays: e.WEBHOOK_RETRY_DELAYS.split(',').map((s) => Number(s.trim())),
    webhookInFlightPerEndpoint: e.WEBHOOK_IN_FLIGHT_PER_ENDPOINT,
    agentStaleMinutes: e.AGENT_STALE_MINUTES,
    trustProxy: trustProxy(e.TRUST_PROXY),
    releaseRequiresSecondPerson: e.RELEASE_REQUIRES_SECOND_PERSON,
    version: APP_VERSION,
  };
}

/** A configuration for tests: in-memory database, quiet logs, generous limits. */
export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    ...loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_FILE: ':memory:' }),
    loginRateLimitPerMinute: 1000,
    rateLimitPerMinute: 100000,
    ...overrides,
  };
}
