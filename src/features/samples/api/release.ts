// Releasing and amending a sample, and its revision history.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { sampleKeys } from '../../../api/query-keys.ts';
import type { components } from '../../../api/schema';

export type ReleaseRequest = components['schemas']['ReleaseRequest'];
export type AmendmentRequest = components['schemas']['AmendmentRequest'];
export type Revision = components['schemas']['SampleRevisionList']['data'][number];

export const revisionsQuery = (id: string) =>
  queryOptions({
    queryKey: sampleKeys.revisions(id),
    queryFn: () => unwrap(api.GET('/samples/{id}/revisions', { params: { path: { id } } })),
  });

export const useRevisions = (id: string, enabled: boolean) => useQuery({ ...revisionsQuery(id), enabled });

/** A released or amended sample: its views, the lists and its revisions go stale. */
function useSampleChanged() {
  const queryClient = useQueryClient();
  return (id: string) =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: sampleKeys.details(id) }),
      queryClient.invalidateQueries({ queryKey: sampleKeys.lists() }),
      queryClient.invalidateQueries({ queryKey: sampleKeys.revisions(id) }),
    ]);
}

export function useReleaseSample() {
  const changed = useSampleChanged();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: ReleaseRequest }) =>
      unwrap(api.POST('/samples/{id}/release', { params: { path: { id } }, body })),
    onSuccess: (sample) => changed(sample.id),
  });
}

export function useAmendSample() {
  const changed = useSampleChanged();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: AmendmentRequest }) =>
      unwrap(api.POST('/samples/{id}/amendments', { params: { path: { id } }, body })),
    onSuccess: (sample) => changed(sample.id),
  });
}
