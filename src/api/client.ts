// The console's one API client: openapi-fetch typed by the generated schema, same-origin cookies.
import createClient from 'openapi-fetch';
import type { paths } from './schema';
import { ApiProblem, NETWORK_PROBLEM, problemFromResponse } from './problem.ts';

/** Marks the console's own calls, which the Request log leaves out unless asked (server/http/request-log.ts). */
export const CONSOLE_CLIENT_HEADER = ['X-Meltwire-Client', 'console'] as const;

export const api = createClient<paths>({
  baseUrl: '/api/v1',
  credentials: 'same-origin',
  headers: { [CONSOLE_CLIENT_HEADER[0]]: CONSOLE_CLIENT_HEADER[1] },
});

/** Returns the data of a successful call, or throws the problem as an ApiProblem. */
export async function unwrap<T>(call: Promise<{ data?: T; error?: unknown; response: Response }>): Promise<T> {
  let result: { data?: T; error?: unknown; response: Response };
  try {
    result = await call;
  } catch {
    throw new ApiProblem(NETWORK_PROBLEM);
  }
  if (result.response.ok) return result.data as T;
  throw problemFromResponse(result.response.status, result.response.statusText, result.error);
}
