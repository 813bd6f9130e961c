// The session cookie's content: a short-lived signed JWT naming a server-side session row,
// so sign-out and role changes take effect at once.
import jwt from 'jsonwebtoken';

export const SESSION_COOKIE = 'mw_session';
/** A session ends this long after sign-in, however active it was. */
export const SESSION_ABSOLUTE_HOURS = 12;

export interface SessionClaims {
  sid: string;
  sub: string;
  iat: number;
  exp: number;
}

export function signSessionToken(secret: string, sessionId: string, userId: string, ttlMinutes: number): string {
  return jwt.sign({ sid: sessionId }, secret, { subject: userId, expiresIn: ttlMinutes * 60, algorithm: 'HS256', issuer: 'meltwire' });
}

export function verifySessionToken(secret: string, token: string): SessionClaims | undefined {
  try {
    const claims = jwt.verify(token, secret, { algorithms: ['HS256'], issuer: 'meltwire' });
    if (typeof claims === 'object' && typeof claims.sid === 'string' && typeof claims.sub === 'string') {
      return claims as SessionClaims;
    }
  } catch {
    // expired, tampered or foreign tokens are simply not sessions
  }
  return undefined;
}

/** Sliding renewal: reissue once less than half of the lifetime is left. */
export function needsRenewal(claims: SessionClaims, ttlMinutes: number, nowSeconds = Date.now() / 1000): boolean {
  return claims.exp - nowSeconds < (ttlMinutes * 60) / 2;
}
