import { infiniteQueryOptions, useInfiniteQuery, useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { RoleValues } from '../../../api/openapi-enums.ts';
import type { components } from '../../../api/schema';
import { userKeys } from '../../../api/query-keys.ts';

export type User = components['schemas']['User'];
export type Role = components['schemas']['Role'];
export const ROLES: readonly Role[] = RoleValues;

const usersQuery = infiniteQueryOptions({
  queryKey: userKeys.all,
  queryFn: ({ pageParam }) => unwrap(api.GET('/users', { params: { query: { limit: 50, cursor: pageParam } } })),
  initialPageParam: undefined as string | undefined,
  getNextPageParam: (page) => page.next_cursor ?? undefined,
});

export function useUsers() {
  return useInfiniteQuery(usersQuery);
}

export function useInviteUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; name: string; role: Role }) => unwrap(api.POST('/users', { body })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: { id: string; role?: Role; status?: 'active' | 'disabled'; name?: string }) =>
      unwrap(api.PATCH('/users/{id}', { params: { path: { id } }, body })),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
}

export function useResendInvitation() {
  return useMutation({
    mutationFn: (id: string) => unwrap(api.POST('/users/{id}/invitation', { params: { path: { id } } })),
  });
}
