// Rate limits (express-rate-limit, draft-8 RateLimit + RateLimit-Policy headers): one budget per
// API key, signed-in user or — for anonymous calls — client address, and a stricter one for
// credential endpoints. Over budget → 429 problem with Retry-After. On PostgreSQL the counts live
// in the database (shared-rate-store.ts), so several nodes share each budget.
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppContext } from '../context.ts';
import { isPostgres } from '../db/dialect.ts';
import { RateLimitedProblem } from '../lib/problems.ts';
import { SharedRateStore } from './shared-rate-store.ts';

/** The store of one budget: shared in PostgreSQL mode, express-rate-limit's memory store otherwise. */
function storeFor(ctx: AppContext, identifier: string) {
  return isPostgres(ctx.db) ? { store: new SharedRateStore(ctx.db, identifier) } : {};
}

const credentialLimiters = new WeakMap<AppContext, RequestHandler[]>();

/** The account a credential call is about (sign-in, password reset), by its e-mail ignoring case. */
function accountKey(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? `account:${email.trim().toLowerCase()}` : 'account:none';
}

/**
 * Shared by sign-in, invitation and password-reset endpoints of one app: one budget per client
 * address, and one per account, so guessing one user's password from many addresses is slowed too.
 */
export function credentialLimiter(ctx: AppContext): RequestHandler[] {
  let limiters = credentialLimiters.get(ctx);
  if (!limiters) {
    const common = {
      windowMs: 60_000,
      limit: ctx.config.loginRateLimitPerMinute,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
    } as const;
    limiters = [
      rateLimit({
        ...common,
        ...storeFor(ctx, 'credentials'),
        identifier: 'credentials',
        handler: (_req, _res, next) => next(new RateLimitedProblem('Too many sign-in attempts from this address; wait a minute.')),
      }),
      rateLimit({
        ...common,
        ...storeFor(ctx, 'credentials-account'),
        identifier: 'credentials-account',
        keyGenerator: accountKey,
        skip: (req) => accountKey(req) === 'account:none',
        handler: (_req, _res, next) => next(new RateLimitedProblem('Too many sign-in attempts for this account; wait a minute.')),
      }),
    ];
    credentialLimiters.set(ctx, limiters);
  }
  return limiters;
}

function callerKey(req: Request): string {
  if (req.auth?.apiKeyId) return `key:${req.auth.apiKeyId}`;
  if (req.auth) return `user:${req.auth.userId}`;
  return `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`;
}

/** The general budget, applied after authentication so it can count per caller. */
export function apiLimiter(ctx: AppContext): RequestHandler {
  return rateLimit({
    windowMs: 60_000,
    limit: ctx.config.rateLimitPerMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...storeFor(ctx, 'api'),
    identifier: 'api',
    keyGenerator: callerKey,
    handler: (_req, _res, next) => next(new RateLimitedProblem()),
  });
}
