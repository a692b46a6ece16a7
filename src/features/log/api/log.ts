import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { NewLogEntry, StationSettings, newConditionSchema } from '../../../../shared/schemas/log';
import { api } from '../../../lib/api-client';
import { setupKeys } from '../../plant';
import { logKeys, conditionKeys } from './log-keys';
export { logKeys, conditionKeys };
import { sendOrKeep, type QueuedRecord } from '../../offline';

type NewCondition = z.output<typeof newConditionSchema>;

export type LogEntryView = {
  id: number;
  position: string;
  category: string;
  eventAt: string;
  /** When it was written (on the device, for an entry kept offline) and when the server had it. */
  enteredAt: string;
  receivedAt: string;
  shiftStart: string;
  late: boolean;
  /** Arrived more than the station's late-entry minutes after it was written. */
  arrivedLate: boolean;
  author: string;
  authorId: number;
  /** Written by a trainee. */
  writtenAsTrainee: boolean;
  /** Whether the person viewing may amend it (the server's answer: author, or the lead of the crew on that shift). */
  mayAmend: boolean;
  text: string;
  equipmentId: number | null;
  conditionId: number | null;
  carryToHandover: boolean;
  enteredAfterReview: boolean;
  amendments: { id: number; author: string; amendedAt: string; reason: string; text: string; afterReview: boolean }[];
};
export type LogFilters = { position?: string; category?: string; authorId?: number; shiftStart?: string };
export type ShiftsView = {
  settings: StationSettings;
  shifts: { start: string; label: string }[];
  reviews: { position: string; shiftStart: string; by: string; at: string }[];
};
export type ConditionView = {
  id: number;
  title: string;
  requiredAction: string;
  startedAt: string;
  limitAt: string;
  limitLocal: string;
  timeZone: string;
  owner: string;
  openedBy: string;
  closedBy: string | null;
  closedAt: string | null;
  serverNow: string;
  remainingMs: number;
  state: 'running' | 'due_soon' | 'overdue' | 'closed';
  version: number;
};


const qs = (f: LogFilters) => new URLSearchParams(Object.entries(f).filter(([, v]) => v !== undefined && v !== '').map(([k, v]) => [k, String(v)])).toString();

export const logQueryOptions = (unitId: number, f: LogFilters) =>
  queryOptions({ queryKey: logKeys.entries(unitId, f), queryFn: async () => (await api.get<{ entries: LogEntryView[] }>(`/api/units/${unitId}/log?${qs(f)}`)).entries });
export const useLog = (unitId: number | null, f: LogFilters) => useQuery({ ...logQueryOptions(unitId ?? 0, f), enabled: unitId !== null });

export { useShifts } from './get-shifts';

export const useConditions = (unitId: number | null) =>
  useQuery({
    queryKey: conditionKeys.list(unitId ?? 0),
    queryFn: async () => (await api.get<{ conditions: ConditionView[] }>(`/api/units/${unitId}/conditions`)).conditions,
    enabled: unitId !== null,
    refetchInterval: 60_000,
  });

function useInvalidating<T, R>(fn: (input: T) => Promise<R>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: logKeys.all });
      void queryClient.invalidateQueries({ queryKey: conditionKeys.all });
    },
  });
}

type SavedEntry = { id: number; late: boolean; arrivedLate: boolean };
/** Sends the entry, or keeps it on the device when the server cannot be reached (`kept`). */
export const useAddEntry = (unitId: number) =>
  useInvalidating(
    ({ entry, userId }: { entry: NewLogEntry; userId: number }): Promise<{ saved?: SavedEntry; kept?: QueuedRecord }> =>
      sendOrKeep<SavedEntry>({ kind: 'log_entry', userId, unitId, payload: entry, summary: entry.text }),
  );
export const useAmendEntry = () => useInvalidating((a: { id: number; reason: string; text: string }) => api.post(`/api/log/${a.id}/amendments`, { reason: a.reason, text: a.text }));
export const useSignReview = (unitId: number) => useInvalidating((r: { position: string; shiftStart: string }) => api.post(`/api/units/${unitId}/log/reviews`, r));
export const useOpenCondition = (unitId: number) =>
  useInvalidating((c: NewCondition) => api.post(`/api/units/${unitId}/conditions`, c));
export const useCloseCondition = () =>
  useInvalidating((c: { id: number; text: string; position: string; version: number }) => api.post(`/api/conditions/${c.id}/close`, { text: c.text, position: c.position, version: c.version }));

export const useEquipment = (unitId: number | null) =>
  useQuery({
    queryKey: setupKeys.equipment(unitId ?? 0),
    queryFn: async () => (await api.get<{ equipment: { id: number; tag: string; name: string }[] }>(`/api/plant/units/${unitId}/setup`)).equipment,
    enabled: unitId !== null,
    staleTime: 5 * 60_000,
  });
