import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangePasswordInput, PublicUser } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { sessionKeys } from './session-keys';

export const changePassword = async (input: ChangePasswordInput) =>
  (await api.post<{ user: PublicUser }>('/api/me/password', input)).user;

export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    onSuccess: (user) => queryClient.setQueryData(sessionKeys.me(), user),
  });
}
