// The console's one API client: openapi-fetch typed by the generated schema, same-origin cookies.
import createClient from 'openapi-fetch';
import type { paths } from './schema';
import { ApiProblem, type ProblemBody } from './problem.ts';

export const api = createClient<paths>({ baseUrl: '/api/v1', credentials: 'same-origin' });

/** Returns the data of a successful call, or throws the problem as an ApiProblem. */
export async function unwrap<T>(call: Promise<{ data?: T; error?: unknown; response: Response }>): Promise<T> {
  let result: { data?: T; error?: unknown; response: Response };
  try {
    result = await call;
  } catch {
    throw new ApiProblem({ type: 'network', title: 'The server cannot be reached', status: 0, detail: 'Check the connection and try again.' });
  }
  if (result.response.ok) return result.data as T;
  const error = result.error as Partial<ProblemBody> | undefined;
  throw new ApiProblem({
    type: error?.type ?? 'about:blank',
    title: error?.title ?? result.response.statusText ?? 'Request failed',
    status: result.response.status,
    detail: error?.detail,
    errors: error?.errors,
  });
}
