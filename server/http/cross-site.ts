// CSRF defence for the console's session cookie, by the headers browsers send on their own
// (origin check with Fetch Metadata): a write that carries the session cookie, or signs in, is
// refused when its Origin names another origin, or when there is no Origin and Sec-Fetch-Site
// says another site sent it. A request with neither header is not from a browser and passes;
// API-key calls (Authorization: Bearer) carry no ambient credential and are not checked.
import type { Request, RequestHandler } from 'express';
import type { Config } from '../config.ts';
import { SESSION_COOKIE } from '../domain/auth/session-token.ts';
import { CrossSiteProblem } from '../lib/problems.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Writes that need no cookie yet but must not be sent by another site (login CSRF). */
const COOKIE_SETTING_PATHS = new Set(['/auth/login', '/auth/accept-invitation']);

function originOf(url: string): string | null {
  try {
    return new URL(url).origin;
  } catch {
    return null;
  }
}

function usesSessionCookie(req: Request): boolean {
  if (req.get('authorization')) return false;
  return typeof req.cookies?.[SESSION_COOKIE] === 'string' || COOKIE_SETTING_PATHS.has(req.path);
}

/** The origins a same-site request may come from: PUBLIC_URL's, and the one this request was sent to. */
function ownOrigins(req: Request, config: Config): Set<string> {
  const own = new Set<string>();
  const published = originOf(config.publicUrl);
  if (published) own.add(published);
  const host = req.get('host');
  if (host) {
    const target = originOf(`${req.protocol}://${host}`);
    if (target) own.add(target);
  }
  return own;
}

export function crossSiteGuard(config: Config): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || !usesSessionCookie(req)) return next();
    const origin = req.get('origin');
    if (origin !== undefined) {
      if (!ownOrigins(req, config).has(origin)) {
        throw new CrossSiteProblem(
          `This request came from ${origin}, not from Meltwire's own pages; signed-in writes are accepted only from them.`,
        );
      }
      return next();
    }
    const site = req.get('sec-fetch-site');
    if (site === 'cross-site' || site === 'same-site') {
      throw new CrossSiteProblem(
        `The browser says another site (${site}) sent this request; signed-in writes are accepted only from Meltwire's own pages.`,
      );
    }
    next();
  };
}
