import type { Scope } from '../domain/auth/scopes.ts';
import type { Role } from '../domain/auth/scopes.ts';

/** Who is calling: a signed-in user (session cookie) or an API key. */
export interface AuthContext {
  kind: 'session' | 'api_key';
  userId: string;
  email: string;
  role: Role;
  scopes: ReadonlySet<Scope>;
  sessionId?: string;
  apiKeyId?: string;
  /** An API key restricted to some instruments; null or absent = all instruments. */
  instrumentIds?: string[] | null;
  /** Text recorded as the actor in audit events and logs. */
  label: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** From x-request-id, or generated; echoed in the response and in problems. */
      requestId: string;
      auth?: AuthContext;
    }
  }
}

export {};
