import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicUser } from '../../../../shared/schemas/auth';
import { ApiError, api } from '../../../lib/api-client';
import { sessionKeys } from './session-keys';

/** The signed-in person, or null when nobody is signed in. */
export async function getMe(): Promise<PublicUser | null> {
  try {
    return (await api.get<{ user: PublicUser }>('/api/me')).user;
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: sessionKeys.me(), queryFn: getMe, staleTime: 60_000 });
export const useMe = () => useQuery(meQueryOptions());
