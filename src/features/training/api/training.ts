import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { NewTrainingEntry, TaskStatus, TrainingLevel } from '../../../../shared/schemas/training';
import { api } from '../../../lib/api-client';
import { trainingKeys } from './training-keys';
export { trainingKeys };

export type TaskView = {
  id: number;
  taskKey: string;
  version: number;
  position: string;
  system: string;
  title: string;
  standard: string;
  procedureRef: string | null;
  requiredPerformances: number;
  retired: boolean;
  changeNote: string | null;
  createdAt: string;
};

type Amendment = { id: number; by: string; at: string; reason: string; text: string };
export type EntryView = {
  id: number;
  taskKey: string;
  taskTitle: string;
  taskVersion: number;
  performedOn: string;
  level: TrainingLevel;
  note: string;
  supervisor: string | null;
  status: 'awaiting_countersign' | 'countersigned' | 'rejected';
  countersignedBy: string | null;
  countersignedAt: string | null;
  rejectReason: string | null;
  recordedAt: string;
  unitId: number | null;
  shiftStart: string | null;
  readingSetId: number | null;
  handoverItemId: number | null;
  amendments: Amendment[];
};
export type DecisionView = { id: number; taskKey: string; taskVersion: number | null; decision: 'signed_off' | 'returned'; comments: string; trainer: string; decidedAt: string; amendments: Amendment[] };
export type ProgressRow = {
  task: TaskView;
  status: TaskStatus;
  counts: { observed: number; supervised: number; alone: number; awaitingCountersign: number; rejected: number };
  performances: number;
  firstPracticeOn: string | null;
  lastPracticeOn: string | null;
  lastDecision: DecisionView | null;
  signedVersion: number | null;
  newerVersionSinceSignOff: boolean;
};
export type Progress = { trainee: { id: number; name: string; role: string }; rows: ProgressRow[]; left: number; entries: EntryView[]; decisions: DecisionView[] };
export type QueueEntry = {
  id: number;
  trainee: string;
  traineeId: number;
  taskKey: string;
  taskTitle: string;
  taskVersion: number | null;
  performedOn: string;
  level: TrainingLevel;
  note: string;
  supervisor: string | null;
  countersignedBy?: string | null;
  recordedAt: string;
};


export const useTasks = () => useQuery({ queryKey: trainingKeys.tasks(), queryFn: async () => (await api.get<{ tasks: TaskView[] }>('/api/training/tasks')).tasks });
export const useTaskVersions = (key: string | null) =>
  useQuery({ queryKey: trainingKeys.versions(key ?? ''), queryFn: async () => (await api.get<{ versions: TaskView[] }>(`/api/training/tasks/${key}/versions`)).versions, enabled: key !== null });
export const useMyProgress = (enabled: boolean) => useQuery({ queryKey: trainingKeys.me(), queryFn: () => api.get<Progress>('/api/training/me'), enabled });
export const useTraineeProgress = (id: number) => useQuery({ queryKey: trainingKeys.trainee(id), queryFn: () => api.get<Progress>(`/api/training/trainees/${id}`) });
export const useCountersignQueue = (enabled: boolean) =>
  useQuery({ queryKey: trainingKeys.countersign(), queryFn: async () => (await api.get<{ entries: QueueEntry[] }>('/api/training/countersign-queue')).entries, enabled });
export const useReviewQueue = (enabled: boolean) =>
  useQuery({
    queryKey: trainingKeys.review(),
    queryFn: () =>
      api.get<{
        trainees: { id: number; name: string; left: number; signedOff: number }[];
        ready: { traineeId: number; trainee: string; taskKey: string; taskTitle: string; performances: number; required: number }[];
        recentlyCountersigned: (EntryView & { trainee: string; traineeId: number })[];
        awaiting: QueueEntry[];
      }>('/api/training/review-queue'),
    enabled,
  });
export const useCrewQualifications = (crewId: number | null) =>
  useQuery({
    queryKey: trainingKeys.crew(crewId ?? 0),
    queryFn: () => api.get<{ crew: { id: number; name: string }; tasks: TaskView[]; people: { id: number; name: string; role: string; signedOff: { taskKey: string; at: string }[] }[] }>(`/api/training/crews/${crewId}`),
    enabled: crewId !== null,
  });

/** Every training write refreshes every training view: they are small and tied together. */
function useTrainingMutation<I, O>(fn: (input: I) => Promise<O>) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => queryClient.invalidateQueries({ queryKey: trainingKeys.all }) });
}

export const useRecordEntry = () => useTrainingMutation((input: NewTrainingEntry) => api.post<{ id: number }>('/api/training/entries', input));
export const useSettleEntry = () =>
  useTrainingMutation((input: { id: number; action: 'countersign' } | { id: number; action: 'reject'; reason: string }) =>
    api.post(`/api/training/entries/${input.id}/${input.action}`, input.action === 'reject' ? { reason: input.reason } : {}),
  );
export const useDecide = () =>
  useTrainingMutation((input: { traineeId: number; taskKey: string; decision: 'signed_off' | 'returned'; comments: string }) => api.post('/api/training/decisions', input));
export const useAmendTraining = () =>
  useTrainingMutation((input: { target: 'entry' | 'decision'; targetId: number; reason: string; text: string }) => api.post('/api/training/amendments', input));
export const useSaveTask = () =>
  useTrainingMutation((input: { mode: 'create' | 'change'; taskKey: string; body: Record<string, unknown> }) =>
    input.mode === 'create' ? api.post('/api/training/tasks', { ...input.body, taskKey: input.taskKey }) : api.put(`/api/training/tasks/${input.taskKey}`, input.body),
  );
export const useRetireTask = () => useTrainingMutation((input: { taskKey: string; changeNote: string }) => api.post(`/api/training/tasks/${input.taskKey}/retire`, { changeNote: input.changeNote }));
