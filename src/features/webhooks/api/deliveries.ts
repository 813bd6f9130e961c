import { infiniteQueryOptions, queryOptions, useInfiniteQuery, useQuery } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { webhookKeys } from '../../../api/query-keys.ts';
import { useWebhookMutation } from './endpoints.ts';

export type WebhookDelivery = components['schemas']['WebhookDelivery'];
export type WebhookDeliveryDetail = components['schemas']['WebhookDeliveryDetail'];
export type WebhookAttempt = components['schemas']['WebhookAttempt'];

// The log changes on its own as the worker attempts deliveries: poll while the page is open.
const REFRESH_MS = 2000;

export function useDeliveries(endpointId: string) {
  return useInfiniteQuery(
    infiniteQueryOptions({
      queryKey: webhookKeys.deliveries(endpointId),
      queryFn: ({ pageParam }) =>
        unwrap(
          api.GET('/webhook-endpoints/{id}/deliveries', { params: { path: { id: endpointId }, query: { limit: 50, cursor: pageParam } } }),
        ),
      initialPageParam: undefined as string | undefined,
      getNextPageParam: (page) => page.next_cursor ?? undefined,
      refetchInterval: REFRESH_MS,
    }),
  );
}

export function useDelivery(id: string | null) {
  return useQuery(
    queryOptions({
      queryKey: webhookKeys.delivery(id ?? ''),
      queryFn: () => unwrap(api.GET('/webhook-deliveries/{id}', { params: { path: { id: id ?? '' } } })),
      enabled: !!id,
      refetchInterval: REFRESH_MS,
    }),
  );
}

export function useRetryDelivery() {
  return useWebhookMutation((id: string) => unwrap(api.POST('/webhook-deliveries/{id}/retry', { params: { path: { id } } })));
}

export function useSendTestEvent(endpointId: string) {
  return useWebhookMutation(() => unwrap(api.POST('/webhook-endpoints/{id}/test', { params: { path: { id: endpointId } } })));
}

export function useRecoverDeliveries(endpointId: string) {
  return useWebhookMutation((since: string) =>
    unwrap(api.POST('/webhook-endpoints/{id}/recover', { params: { path: { id: endpointId } }, body: { since } })),
  );
}
