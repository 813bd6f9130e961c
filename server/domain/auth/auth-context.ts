// The caller of a request as the domain sees it; server/http/authenticate.ts works it out.
import type { Role, Scope } from './scopes.ts';

/** Who is calling: a signed-in user (session cookie) or an API key. */
export interface AuthContext {
  kind: 'session' | 'api_key';
  userId: string;
  email: string;
  role: Role;
  scopes: ReadonlySet<Scope>;
  sessionId?: string;
  apiKeyId?: string;
  /** When the calling API key expires; keys it issues may not outlive it. */
  keyExpiresAt?: string | null;
  /** An API key restricted to some instruments; null or absent = all instruments. */
  instrumentIds?: string[] | null;
  /** Text recorded as the actor in audit events and logs. */
  label: string;
}
