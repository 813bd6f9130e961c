import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { meQuery } from '../../../api/me.ts';

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; password: string }) => unwrap(api.POST('/auth/login', { body })),
    onSuccess: (me) => queryClient.setQueryData(meQuery.queryKey, me),
  });
}

export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => unwrap(api.POST('/auth/logout')),
    onSettled: () => {
      queryClient.clear();
      queryClient.setQueryData(meQuery.queryKey, null);
    },
  });
}

export function useAcceptInvitation() {
  return useMutation({
    mutationFn: (body: { token: string; password: string }) => unwrap(api.POST('/auth/accept-invitation', { body })),
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (body: { email: string }) => unwrap(api.POST('/auth/password-reset', { body })),
  });
}

export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (body: { token: string; password: string }) => unwrap(api.POST('/auth/password-reset/confirm', { body })),
  });
}
