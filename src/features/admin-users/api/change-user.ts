import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateUserInput, PublicUser, UpdateUserInput } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { auditKeys } from '../../audit';
import { userKeys } from './user-keys';

type UserChange =
  | { kind: 'create'; input: CreateUserInput }
  | { kind: 'update'; id: number; input: UpdateUserInput }
  | { kind: 'deactivate' | 'reactivate'; id: number; version: number };

export async function changeUser(change: UserChange): Promise<PublicUser> {
  switch (change.kind) {
    case 'create':
      return (await api.post<{ user: PublicUser }>('/api/admin/users', change.input)).user;
    case 'update':
      return (await api.patch<{ user: PublicUser }>(`/api/admin/users/${change.id}`, change.input)).user;
    default:
      return (await api.post<{ user: PublicUser }>(`/api/admin/users/${change.id}/${change.kind}`, { version: change.version })).user;
  }
}

export function useChangeUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeUser,
    onSettled: () => {
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      void queryClient.invalidateQueries({ queryKey: auditKeys.all });
    },
  });
}
