import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PublicUser, SignInInput } from '../../../../shared/schemas/auth';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import { sessionKeys } from './session-keys';

export async function signIn(input: SignInInput): Promise<PublicUser> {
  const result = await api.post<{ user: PublicUser; csrfToken: string }>('/api/session', input);
  rememberCsrfToken(result.csrfToken);
  return result.user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Whatever the previous person had loaded must not show for this one.
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.me(), user);
    },
  });
}
