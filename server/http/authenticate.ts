// Works out who is calling, without deciding whether they may: a Bearer API key or the
// session cookie. Invalid credentials are a 401 here; missing ones are left to each route.
import type { RequestHandler } from 'express';
import type { AppContext } from '../context.ts';
import { authenticateApiKey } from '../domain/api-keys/api-keys.auth.ts';
import { resolveSession, touchSession } from '../domain/auth/auth.service.ts';
import { needsRenewal, SESSION_COOKIE, verifySessionToken } from '../domain/auth/session-token.ts';
import { UnauthorizedProblem } from '../lib/problems.ts';
import { clearSessionCookie, setSessionCookie } from './session-cookie.ts';

export function authenticate(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    const header = req.get('authorization');
    if (header) {
      const match = /^Bearer\s+(\S+)$/i.exec(header);
      if (!match) throw new UnauthorizedProblem('The Authorization header must be "Bearer <api key>".');
      req.auth = await authenticateApiKey(ctx, match[1]);
      return next();
    }
    const token: unknown = req.cookies?.[SESSION_COOKIE];
    if (typeof token !== 'string') return next();
    const claims = verifySessionToken(ctx.config.sessionSecret, token);
    const auth = claims && (await resolveSession(ctx, claims.sid, claims.sub));
    if (!claims || !auth) {
      // A stale cookie is not an error on public routes: drop it and carry on anonymously.
      clearSessionCookie(res, ctx.config);
      return next();
    }
    req.auth = auth;
    res.locals.sessionExpiresAt = new Date(claims.exp * 1000).toISOString();
    if (needsRenewal(claims, ctx.config.sessionTtlMinutes)) {
      setSessionCookie(res, ctx.config, claims.sid, claims.sub);
      await touchSession(ctx, claims.sid);
    }
    next();
  };
}
