// A key never outgrows the caller that issues it: no scope the caller lacks, no instrument outside
// the caller's restriction, no life beyond the caller's own key. A restriction the new key leaves
// out is inherited when a key is created; rolling a key broader than the caller is refused.
import { ForbiddenProblem } from '../../lib/problems.ts';
import type { AuthContext } from '../auth/auth-context.ts';
import type { Scope } from '../auth/scopes.ts';

export interface KeyGrant {
  scopes: Scope[];
  instrument_ids?: string[];
  expires_at?: string;
}

function boundScopes(auth: AuthContext, scopes: Scope[]): void {
  const missing = scopes.filter((scope) => !auth.scopes.has(scope));
  if (missing.length > 0) {
    throw new ForbiddenProblem(`You cannot grant scopes you do not hold: ${missing.join(', ')}.`, { scopes_not_held: missing });
  }
}

function boundInstruments(auth: AuthContext, requested: string[] | undefined, inherit: boolean): string[] | undefined {
  const allowed = auth.instrumentIds;
  if (!allowed) return requested;
  if (!requested) {
    if (inherit) return [...allowed];
    throw new ForbiddenProblem('Your API key is restricted to some instruments: it cannot pass on access to every instrument.', {
      instruments_not_held: 'all',
    });
  }
  const outside = requested.filter((id) => !allowed.includes(id));
  if (outside.length > 0) {
    throw new ForbiddenProblem(`Your API key is not allowed these instruments: ${outside.join(', ')}.`, { instruments_not_held: outside });
  }
  return requested;
}

function boundExpiry(auth: AuthContext, requested: string | undefined, inherit: boolean): string | undefined {
  const limit = auth.keyExpiresAt;
  if (!limit) return requested;
  if (!requested) {
    if (inherit) return limit;
    throw new ForbiddenProblem(`Your API key expires at ${limit}: it cannot pass on access that never expires.`, {
      expires_at_limit: limit,
    });
  }
  if (new Date(requested).getTime() > new Date(limit).getTime()) {
    throw new ForbiddenProblem(`Your API key expires at ${limit}: a key it issues cannot live longer.`, { expires_at_limit: limit });
  }
  return requested;
}

/** The grant as it may be issued by this caller; `inherit` fills in the caller's restrictions where the grant has none. */
export function boundByCaller<G extends KeyGrant>(auth: AuthContext, grant: G, options: { inherit: boolean }): G {
  boundScopes(auth, grant.scopes);
  return {
    ...grant,
    instrument_ids: boundInstruments(auth, grant.instrument_ids, options.inherit),
    expires_at: boundExpiry(auth, grant.expires_at, options.inherit),
  };
}
