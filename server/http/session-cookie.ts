import type { CookieOptions, Response } from 'express';
import type { Config } from '../config.ts';
import { SESSION_COOKIE, signSessionToken } from '../domain/auth/session-token.ts';

function cookieOptions(config: Config): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.publicUrl.startsWith('https://'),
    path: '/',
    maxAge: config.sessionTtlMinutes * 60_000,
  };
}

export function setSessionCookie(res: Response, config: Config, sessionId: string, userId: string): string {
  const expiresAt = new Date(Date.now() + config.sessionTtlMinutes * 60_000).toISOString();
  res.cookie(SESSION_COOKIE, signSessionToken(config.sessionSecret, sessionId, userId, config.sessionTtlMinutes), cookieOptions(config));
  res.locals.sessionExpiresAt = expiresAt;
  return expiresAt;
}

export function clearSessionCookie(res: Response, config: Config): void {
  const { maxAge: _maxAge, ...options } = cookieOptions(config);
  res.clearCookie(SESSION_COOKIE, options);
}
