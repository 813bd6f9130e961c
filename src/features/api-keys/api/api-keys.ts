import { infiniteQueryOptions, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import type { components } from '../../../api/schema';
import { apiKeyKeys } from '../../../api/query-keys.ts';

export type ApiKey = components['schemas']['ApiKey'];
export type CreateApiKeyRequest = components['schemas']['CreateApiKeyRequest'];

const apiKeysQuery = (includeRevoked: boolean) =>
  infiniteQueryOptions({
    queryKey: apiKeyKeys.list(includeRevoked),
    queryFn: ({ pageParam }) =>
      unwrap(
        api.GET('/api-keys', { params: { query: { limit: 50, cursor: pageParam, include_revoked: includeRevoked ? 'true' : 'false' } } }),
      ),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.next_cursor ?? undefined,
  });

export function useApiKeys(includeRevoked: boolean) {
  return useInfiniteQuery(apiKeysQuery(includeRevoked));
}

function useKeyMutation<TInput, TOutput>(fn: (input: TInput) => Promise<TOutput>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: apiKeyKeys.all }) });
}

export function useCreateApiKey() {
  return useKeyMutation((body: CreateApiKeyRequest) => unwrap(api.POST('/api-keys', { body })));
}

export function useRevokeApiKey() {
  return useKeyMutation((id: string) => unwrap(api.DELETE('/api-keys/{id}', { params: { path: { id } } })));
}

export function useRollApiKey() {
  return useKeyMutation(({ id, overlap_minutes }: { id: string; overlap_minutes: number }) =>
    unwrap(api.POST('/api-keys/{id}/roll', { params: { path: { id } }, body: { overlap_minutes } })),
  );
}
