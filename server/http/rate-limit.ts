// Rate limits (express-rate-limit, draft-8 RateLimit + RateLimit-Policy headers): one budget per
// API key, signed-in user or — for anonymous calls — client address, and a stricter one for
// credential endpoints. Over budget → 429 problem with Retry-After.
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { AppContext } from '../context.ts';
import { RateLimitedProblem } from '../lib/problems.ts';

const credentialLimiters = new WeakMap<AppContext, RequestHandler>();

/** Shared by sign-in, invitation and password-reset endpoints of one app. */
export function credentialLimiter(ctx: AppContext): RequestHandler[] {
  let limiter = credentialLimiters.get(ctx);
  if (!limiter) {
    limiter = rateLimit({
      windowMs: 60_000,
      limit: ctx.config.loginRateLimitPerMinute,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      identifier: 'credentials',
      handler: (_req, _res, next) => next(new RateLimitedProblem('Too many sign-in attempts from this address; wait a minute.')),
    });
    credentialLimiters.set(ctx, limiter);
  }
  return [limiter];
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
    identifier: 'api',
    keyGenerator: callerKey,
    handler: (_req, _res, next) => next(new RateLimitedProblem()),
  });
}
