import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { toApiQuery, type OutputUnit, type SampleFilters } from '../filters.ts';
import { sampleKeys } from '../../../api/query-keys.ts';

export type SampleSummary = components['schemas']['SampleSummary'];
export type Sample = components['schemas']['Sample'];
export type ElementResult = components['schemas']['ElementResult'];
export type Burn = components['schemas']['Burn'];
export type BurnExclusionPreview = components['schemas']['BurnExclusionPreview'];

const samplesQuery = (filters: SampleFilters, unit: OutputUnit, pageSize = 50) =>
  infiniteQueryOptions({
    queryKey: sampleKeys.list(filters, unit, pageSize),
    queryFn: ({ pageParam }) =>
      unwrap(api.GET('/samples', { params: { query: { ...toApiQuery(filters, unit), limit: pageSize, cursor: pageParam } } })),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.next_cursor ?? undefined,
  });

export function useSamples(filters: SampleFilters, unit: OutputUnit, pageSize?: number) {
  return useInfiniteQuery(samplesQuery(filters, unit, pageSize));
}

const sampleQuery = (id: string, unit: OutputUnit) =>
  queryOptions({
    queryKey: sampleKeys.detail(id, unit),
    queryFn: () => unwrap(api.GET('/samples/{id}', { params: { path: { id }, query: { unit } } })),
  });

export function useSample(id: string, unit: OutputUnit) {
  return useQuery(sampleQuery(id, unit));
}

export interface BurnExclusionInput {
  sampleId: string;
  burn: number;
  excluded: boolean;
  reason: string;
}

/** Excludes or includes a burn; every cached view of the sample (any unit) and the lists go stale. */
export function useSetBurnExclusion() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ sampleId, burn, excluded, reason }: BurnExclusionInput) =>
      unwrap(api.PATCH('/samples/{id}/burns/{n}', { params: { path: { id: sampleId, n: burn } }, body: { excluded, reason } })),
    onSuccess: (_sample, input) =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: sampleKeys.details(input.sampleId) }),
        queryClient.invalidateQueries({ queryKey: sampleKeys.lists() }),
      ]),
  });
}

/** What excluding (or including) a burn would change, computed by the server without storing anything. */
export function useBurnExclusionPreview(sampleId: string, burn: Burn | null, unit: OutputUnit) {
  const excluded = !burn?.excluded;
  const number = burn?.number ?? 0;
  return useQuery({
    queryKey: sampleKeys.exclusionPreview(sampleId, number, excluded, unit),
    queryFn: () =>
      unwrap(
        api.GET('/samples/{id}/burns/{n}/exclusion-preview', {
          params: { path: { id: sampleId, n: number }, query: { excluded: excluded ? 'true' : 'false', unit } },
        }),
      ),
    enabled: burn !== null,
  });
}
