import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicUser } from '../../../../shared/schemas/auth';
import { api } from '../../../lib/api-client';
import { userKeys } from './user-keys';

export const getUsers = async () => (await api.get<{ users: PublicUser[] }>('/api/admin/users')).users;
export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: getUsers });
export const useUsers = () => useQuery(usersQueryOptions());
