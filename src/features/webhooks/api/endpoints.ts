import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { webhookKeys } from '../../../api/query-keys.ts';

export type WebhookEndpoint = components['schemas']['WebhookEndpoint'];
export type CreateEndpointRequest = components['schemas']['CreateWebhookEndpointRequest'];
export type UpdateEndpointRequest = components['schemas']['UpdateWebhookEndpointRequest'];
export type EventType = components['schemas']['EventType'];

const endpointsQuery = infiniteQueryOptions({
  queryKey: webhookKeys.list(),
  queryFn: ({ pageParam }) => unwrap(api.GET('/webhook-endpoints', { params: { query: { limit: 50, cursor: pageParam } } })),
  initialPageParam: undefined as string | undefined,
  getNextPageParam: (page) => page.next_cursor ?? undefined,
});

export function useWebhookEndpoints() {
  return useInfiniteQuery(endpointsQuery);
}

export function useWebhookEndpoint(id: string) {
  return useQuery(
    queryOptions({
      queryKey: webhookKeys.endpoint(id),
      queryFn: () => unwrap(api.GET('/webhook-endpoints/{id}', { params: { path: { id } } })),
    }),
  );
}

/** A mutation that refreshes every webhook view once it succeeds. */
export function useWebhookMutation<TInput, TOutput>(fn: (input: TInput) => Promise<TOutput>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: webhookKeys.all }) });
}

export function useCreateEndpoint() {
  return useWebhookMutation((body: CreateEndpointRequest) => unwrap(api.POST('/webhook-endpoints', { body })));
}

export function useUpdateEndpoint(id: string) {
  return useWebhookMutation((body: UpdateEndpointRequest) =>
    unwrap(api.PATCH('/webhook-endpoints/{id}', { params: { path: { id } }, body })),
  );
}

export function useDeleteEndpoint(id: string) {
  return useWebhookMutation(() => unwrap(api.DELETE('/webhook-endpoints/{id}', { params: { path: { id } } })));
}

export function useRotateSecret(id: string) {
  return useWebhookMutation((overlap_minutes: number) =>
    unwrap(api.POST('/webhook-endpoints/{id}/rotate-secret', { params: { path: { id } }, body: { overlap_minutes } })),
  );
}

/** The latest delivery of an endpoint, when the list answers with one (`last_delivery`); older servers do not. */
export function lastDeliveryOf(endpoint: WebhookEndpoint): { status: string; created_at?: string } | null {
  const value = (endpoint as { last_delivery?: unknown }).last_delivery;
  if (value && typeof value === 'object' && typeof (value as { status?: unknown }).status === 'string') {
    return value as { status: string; created_at?: string };
  }
  return null;
}
