import type { AuthContext } from '../auth/auth-context.ts';

export interface Actor {
  type: 'user' | 'api_key' | 'system';
  id: string | null;
  label: string;
}

export const SYSTEM_ACTOR: Actor = { type: 'system', id: null, label: 'system' };

export function actorOf(auth: AuthContext): Actor {
  return auth.kind === 'api_key'
    ? { type: 'api_key', id: auth.apiKeyId ?? null, label: auth.label }
    : { type: 'user', id: auth.userId, label: auth.email };
}
