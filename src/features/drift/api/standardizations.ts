// Standardization runs, the drift series and the sets in force: fetchers, query options, hooks.
import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { driftKeys } from '../../../api/query-keys.ts';

export type Standardization = components['schemas']['Standardization'];
export type ElementCorrection = components['schemas']['ElementCorrection'];
export type CorrectionFlag = components['schemas']['CorrectionFlag'];
export type DriftPoint = components['schemas']['DriftPoint'];
export type CreateStandardizationRequest = components['schemas']['CreateStandardizationRequest'];

const runsQuery = (instrumentId: string, methodId?: string) =>
  infiniteQueryOptions({
    queryKey: driftKeys.runList(instrumentId, methodId ?? null),
    queryFn: ({ pageParam }) =>
      unwrap(
        api.GET('/instruments/{id}/standardizations', {
          params: { path: { id: instrumentId }, query: { limit: 25, cursor: pageParam, method_id: methodId || undefined } },
        }),
      ),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.next_cursor ?? undefined,
  });

export const useRuns = (instrumentId: string, methodId?: string) =>
  useInfiniteQuery({ ...runsQuery(instrumentId, methodId), enabled: !!instrumentId });

const runQuery = (id: string) =>
  queryOptions({
    queryKey: driftKeys.run(id),
    queryFn: () => unwrap(api.GET('/standardizations/{id}', { params: { path: { id } } })),
  });

export const useRun = (id: string) => useQuery(runQuery(id));

const driftQuery = (instrumentId: string, element: string, methodId?: string) =>
  queryOptions({
    queryKey: driftKeys.seriesOf(instrumentId, element, methodId ?? null),
    queryFn: () =>
      unwrap(
        api.GET('/instruments/{id}/drift', {
          params: { path: { id: instrumentId }, query: { element, method_id: methodId || undefined, limit: 200 } },
        }),
      ),
  });

export const useDrift = (instrumentId: string, element: string, methodId?: string) =>
  useQuery({ ...driftQuery(instrumentId, element, methodId), enabled: !!instrumentId && !!element });

const correctionsQuery = (instrumentId: string) =>
  queryOptions({
    queryKey: driftKeys.correctionsOf(instrumentId),
    queryFn: () => unwrap(api.GET('/instruments/{id}/corrections', { params: { path: { id: instrumentId } } })),
  });

export const useCorrectionsInForce = (instrumentId: string) => useQuery({ ...correctionsQuery(instrumentId), enabled: !!instrumentId });

function useInvalidateDrift() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([driftKeys.runs, driftKeys.series, driftKeys.corrections].map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}

export function useCreateRun() {
  const invalidate = useInvalidateDrift();
  return useMutation({
    mutationFn: ({ instrumentId, body }: { instrumentId: string; body: CreateStandardizationRequest }) =>
      unwrap(api.POST('/instruments/{id}/standardizations', { params: { path: { id: instrumentId } }, body })),
    onSuccess: invalidate,
  });
}

export function useActivateRun() {
  const invalidate = useInvalidateDrift();
  return useMutation({
    mutationFn: ({ id, override_reason }: { id: string; override_reason?: string }) =>
      unwrap(api.POST('/standardizations/{id}/activate', { params: { path: { id } }, body: override_reason ? { override_reason } : {} })),
    onSuccess: invalidate,
  });
}
