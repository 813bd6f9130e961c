import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { systemKeys } from '../../../api/query-keys.ts';

export type InstrumentFeed = components['schemas']['InstrumentFeed'];

/** Every instrument's feed; refreshed each minute so a feed going stale shows without a reload. */
export function useInstrumentFeeds() {
  return useQuery(
    queryOptions({
      queryKey: systemKeys.instrumentFeeds(),
      queryFn: () => unwrap(api.GET('/instrument-feeds')),
      refetchInterval: 60_000,
    }),
  );
}
