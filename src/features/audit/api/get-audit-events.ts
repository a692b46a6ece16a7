import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { auditKeys } from './audit-keys';

export type AuditEventView = {
  id: number;
  at: string;
  actor: string;
  action: string;
  entity: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
};

const PAGE = 50;
export const getAuditEvents = async (before?: number) =>
  (await api.get<{ events: AuditEventView[] }>(`/api/admin/audit-events?limit=${PAGE}${before ? `&before=${before}` : ''}`)).events;

export const auditEventsQueryOptions = () =>
  infiniteQueryOptions({
    queryKey: auditKeys.list(),
    queryFn: ({ pageParam }) => getAuditEvents(pageParam),
    initialPageParam: undefined as number | undefined,
    getNextPageParam: (last) => (last.length === PAGE ? last[last.length - 1]!.id : undefined),
  });
export const useAuditEvents = () => useInfiniteQuery(auditEventsQueryOptions());
