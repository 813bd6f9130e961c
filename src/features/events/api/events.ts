import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { eventKeys } from '../../../api/query-keys.ts';

export type FeedEvent = components['schemas']['Event'];

export const EVENTS_PAGE_SIZE = 50;

/** One page of the change feed after a cursor (undefined: from the oldest event kept), optionally of some types only. */
export function useEventFeed(after: string | undefined, types: string) {
  return useQuery(
    queryOptions({
      queryKey: eventKeys.feed(after, types),
      queryFn: () => unwrap(api.GET('/events', { params: { query: { after, types: types || undefined, limit: EVENTS_PAGE_SIZE } } })),
      placeholderData: keepPreviousData,
    }),
  );
}
