// What the HTTP layer adds to every Express request.
import type { AuthContext } from '../domain/auth/auth-context.ts';

declare module 'express-serve-static-core' {
  interface Request {
    /** From x-request-id, or generated; echoed in the response and in problems. */
    requestId: string;
    auth?: AuthContext;
  }
}
