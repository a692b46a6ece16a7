import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { z } from 'zod';
import type { standingOrderSchema } from '../../../../shared/schemas/log';
import { orderKeys } from './order-keys';
export { orderKeys };

export type OrderView = {
  id: number;
  title: string;
  bodyHtml: string;
  effectiveFrom: string;
  effectiveTo: string | null;
  inForce: boolean;
  crewIds: number[];
  positions: string[];
  issuedBy: string;
  issuedAt: string;
  inScope: number;
  acknowledged: number;
  people?: { id: number; name: string; role: string; acknowledgedAt: string | null }[];
};
export type PendingOrder = { id: number; title: string; bodyHtml: string; effectiveFrom: string };


export const useOrders = (state: string, q: string) =>
  useQuery({
    queryKey: orderKeys.list(state, q),
    queryFn: async () => (await api.get<{ orders: OrderView[] }>(`/api/standing-orders?state=${state}&q=${encodeURIComponent(q)}`)).orders,
  });
export const useOrder = (id: number | null) =>
  useQuery({ queryKey: orderKeys.detail(id ?? 0), queryFn: async () => (await api.get<{ order: OrderView }>(`/api/standing-orders/${id}`)).order, enabled: id !== null });
export const usePendingOrders = (enabled: boolean) =>
  useQuery({ queryKey: orderKeys.pending(), queryFn: async () => (await api.get<{ orders: PendingOrder[] }>('/api/me/pending-orders')).orders, enabled });

function useInvalidate() {
  const queryClient = useQueryClient();
  return () => {
    void queryClient.invalidateQueries({ queryKey: orderKeys.all });
  };
}

export function useAcknowledge() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (id: number) => api.post(`/api/standing-orders/${id}/acknowledge`), onSuccess: invalidate });
}

export type NewOrder = z.output<typeof standingOrderSchema>;
export function useIssueOrder() {
  const invalidate = useInvalidate();
  return useMutation({ mutationFn: (order: NewOrder) => api.post<{ order: OrderView }>('/api/standing-orders', order), onSuccess: invalidate });
}
