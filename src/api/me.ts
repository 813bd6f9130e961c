import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from './client.ts';
import { isProblem } from './problem.ts';
import type { components } from './schema';
import { authKeys } from './query-keys.ts';

export type Me = components['schemas']['Me'];
export type Scope = components['schemas']['Scope'];

/** The signed-in caller, or null when there is no session (a 401 is an answer, not an error). */
export const meQuery = queryOptions({
  queryKey: authKeys.me(),
  queryFn: async (): Promise<Me | null> => {
    try {
      return await unwrap(api.GET('/auth/me'));
    } catch (error) {
      if (isProblem(error, 401)) return null;
      throw error;
    }
  },
  staleTime: 60_000,
});

export function useMe() {
  return useQuery(meQuery);
}

export function hasScope(me: Me | null | undefined, scope: Scope): boolean {
  return !!me?.scopes.includes(scope);
}
