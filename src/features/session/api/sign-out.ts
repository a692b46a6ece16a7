import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionKeys } from './session-keys';
import { forgetOfflineCopies } from '../../offline';

export const signOut = () => api.delete<void>('/api/session');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // The next person on this device must not see this person's answers offline (their queued records stay theirs).
      void forgetOfflineCopies();
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}
