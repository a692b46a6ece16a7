import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { sessionKeys } from './session-keys';
import { forgetOfflineCopies, noteSignedInPerson } from '../../offline/shell';

export const signOut = () => api.delete<void>('/api/session');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Before the request: a pass still sending this person's queued records stops at the next one.
    onMutate: () => noteSignedInPerson(null),
    // Whether or not the server heard it (offline, say): the next person on this device must not
    // see this person's answers offline (their queued records stay theirs).
    onSettled: () => void forgetOfflineCopies(),
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(sessionKeys.me(), null);
    },
  });
}
