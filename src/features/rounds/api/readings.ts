import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Evaluation } from '../../../../shared/calc/evaluate';
import type { Status } from '../../../../shared/calc/limits';
import type { PlausibleKey } from '../../../../shared/calc/plausibility';
import type { ReadingSetInput } from '../../../../shared/schemas/reading-set';
import { api } from '../../../lib/api-client';
import { invalidateForChange } from '../../../app/live-keys';
import { readingKeys } from './reading-keys';
import { readingsQueryOptions } from './readings-query';
import { sendOrKeep, type QueuedRecord } from '../../offline';

export type ReadingSummary = {
  id: number;
  takenAt: string;
  /** When it was entered (on the device, for a round kept offline) and when the server had it. */
  enteredAt: string;
  recordedAt: string;
  /** Arrived more than the station's late-entry minutes after it was entered. */
  arrivedLate: boolean;
  recordedBy: string;
  recordedById: number;
  recordedAsTrainee: boolean;
  needsCountersign: boolean;
  source: 'round' | 'import';
  worstStatus: Status;
  amendments: number;
  /** The current version's readings and checks outside the plausible range, confirmed by its author. */
  outsidePlausible: PlausibleKey[];
  raw: ReadingSetInput;
};

export type ReadingDetail = {
  reading: {
    id: number;
    unitId: number;
    takenAt: string;
    recordedAt: string;
    enteredAt: string;
    arrivedLate: boolean;
    recordedBy: string;
    recordedById: number;
    recordedAsTrainee: boolean;
    source: string;
    raw: ReadingSetInput;
    results: Evaluation;
    worstStatus: Status;
    outsidePlausible: PlausibleKey[];
  };
  amendments: {
    id: number;
    amendedAt: string;
    amendedBy: string;
    reason: string;
    raw: ReadingSetInput;
    results: Evaluation;
    worstStatus: Status;
    outsidePlausible: PlausibleKey[];
  }[];
  current: { results: Evaluation; worstStatus: Status; outsidePlausible: PlausibleKey[]; amended: boolean };
  countersign: { by: string; at: string } | null;
};

export { readingsQueryOptions };
export const useReadings = (unitId: number | null) => useQuery({ ...readingsQueryOptions(unitId ?? 0), enabled: unitId !== null });

export const readingQueryOptions = (id: number) =>
  queryOptions({ queryKey: readingKeys.detail(id), queryFn: () => api.get<ReadingDetail>(`/api/readings/${id}`) });
export const useReading = (id: number) => useQuery(readingQueryOptions(id));

type RecordInput = {
  unitId: number;
  /** Who records it: a round kept on the device is sent only while this person is signed in. */
  userId: number;
  reading: Omit<ReadingSetInput, 'unitId'> & { takenAt?: string; confirmOutsidePlausible?: PlausibleKey[] };
  /** For the device's list while it waits: a line of readings and the status judged here. */
  summary: string;
  worstStatus: Status;
};
export type SavedRound = ReadingDetail & { id: number; flagsRaised: number };

/** Sends the round, or keeps it on the device when the server cannot be reached (`kept`). */
export function useRecordReading() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ unitId, userId, reading, summary, worstStatus }: RecordInput) =>
      sendOrKeep<SavedRound>({ kind: 'round', userId, unitId, payload: reading, summary, worstStatus }),
    onSuccess: (outcome: { saved?: SavedRound; kept?: QueuedRecord }, { unitId }) => {
      if (outcome.saved) invalidateForChange(queryClient, { entity: 'reading', id: outcome.saved.id, unitId });
    },
  });
}

export function useAmendReading(id: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: { reason: string; reading: Omit<ReadingSetInput, 'unitId'>; confirmOutsidePlausible?: PlausibleKey[] }) => api.post<ReadingDetail>(`/api/readings/${id}/amendments`, body),
    onSuccess: (saved) => invalidateForChange(queryClient, { entity: 'reading', id, unitId: saved.reading.unitId }),
  });
}

export function useCountersign() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.post<ReadingDetail>(`/api/readings/${id}/countersign`),
    onSuccess: (saved, id) => invalidateForChange(queryClient, { entity: 'reading', id, unitId: saved.reading.unitId }),
  });
}
