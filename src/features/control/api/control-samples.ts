// Control sample definitions, their charts and the disposition of a violation: fetchers, query
// options, hooks.
import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { allPages } from '../../../api/all-pages.ts';
import { api, unwrap } from '../../../api/client.ts';
import { controlKeys } from '../../../api/query-keys.ts';
import type { components } from '../../../api/schema';

export type ControlSample = components['schemas']['ControlSample'];
export type ControlChart = components['schemas']['ControlChart'];
export type ChartPoint = ControlChart['points'][number];
export type StatusChange = components['schemas']['ControlStatusChange'];
export type DispositionRequest = components['schemas']['ControlDispositionRequest'];

const listQuery = queryOptions({
  queryKey: controlKeys.list(),
  queryFn: () => allPages((cursor) => unwrap(api.GET('/control-samples', { params: { query: { limit: 100, cursor } } }))),
});

export const useControlSamples = () => useQuery(listQuery);

const detailQuery = (id: string) =>
  queryOptions({
    queryKey: controlKeys.detail(id),
    queryFn: () => unwrap(api.GET('/control-samples/{id}', { params: { path: { id } } })),
  });

export const useControlSample = (id: string) => useQuery(detailQuery(id));

const chartQuery = (id: string, element: string) =>
  queryOptions({
    queryKey: controlKeys.chart(id, element),
    queryFn: () => unwrap(api.GET('/control-samples/{id}/chart', { params: { path: { id }, query: { element } } })),
  });

export const useControlChart = (id: string, element: string) => useQuery({ ...chartQuery(id, element), enabled: !!id && !!element });

export function useRecordDisposition() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ instrumentId, body }: { instrumentId: string; body: DispositionRequest }) =>
      unwrap(api.POST('/instruments/{id}/control-dispositions', { params: { path: { id: instrumentId } }, body })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: controlKeys.all }),
  });
}
