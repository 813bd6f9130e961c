import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components, operations } from '../../../api/schema';
import { requestLogKeys } from '../../../api/query-keys.ts';

export type RequestLogSummary = components['schemas']['RequestLogSummary'];
export type RequestLogEntry = components['schemas']['RequestLogEntry'];
export type RequestLogFilters = Omit<NonNullable<operations['listRequestLog']['parameters']['query']>, 'limit' | 'cursor'>;

/** Drops empty filter fields so they are not sent as `?method=`. */
function present(filters: RequestLogFilters): RequestLogFilters {
  return Object.fromEntries(Object.entries(filters).filter(([, value]) => value !== undefined && value !== '')) as RequestLogFilters;
}

const requestLogQuery = (filters: RequestLogFilters) =>
  infiniteQueryOptions({
    queryKey: requestLogKeys.list(present(filters)),
    queryFn: ({ pageParam }) =>
      unwrap(api.GET('/request-log', { params: { query: { limit: 50, cursor: pageParam, ...present(filters) } } })),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.next_cursor ?? undefined,
  });

export function useRequestLog(filters: RequestLogFilters) {
  return useInfiniteQuery(requestLogQuery(filters));
}

const requestLogEntryQuery = (id: string) =>
  queryOptions({
    queryKey: requestLogKeys.entry(id),
    queryFn: () => unwrap(api.GET('/request-log/{id}', { params: { path: { id } } })),
    staleTime: Infinity, // entries never change
  });

export function useRequestLogEntry(id: string | null) {
  return useQuery({ ...requestLogEntryQuery(id ?? ''), enabled: !!id });
}

export function useReplay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => unwrap(api.POST('/request-log/{id}/replay', { params: { path: { id } } })),
    onSuccess: (entry) => {
      queryClient.setQueryData(requestLogEntryQuery(entry.id).queryKey, entry);
      return queryClient.invalidateQueries({ queryKey: requestLogKeys.lists() });
    },
  });
}
