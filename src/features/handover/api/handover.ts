import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CondenserSnapshot } from '../../../../shared/shift-condenser';
import { api } from '../../../lib/api-client';

export type BoardItem = {
  id: number;
  kind: string;
  title: string;
  detail: string | null;
  reference: string | null;
  priority: 'low' | 'normal' | 'high';
  live: { state: string; remainingMs: number | null } | null;
  attachments: { id: number; fileName: string; mime: string; size: number }[];
  acknowledgedBy: { userId: number; name: string | null; at: string }[];
  awaiting: string[];
  queries: { id: number; question: string; askedBy: string | null; askedAt: string; answer: string | null; answeredBy: string | null; answeredAt: string | null }[];
};
export type Board = {
  handover: {
    id: number;
    unitId: number;
    shiftStart: string;
    handoverAt: string;
    outgoingCrewId: number | null;
    incomingCrewId: number | null;
    notesHtml: string;
    notesVersion: number;
    status: 'draft' | 'submitted' | 'accepted';
    submittedBy: string | null;
    submittedAt: string | null;
    acceptedBy: string | null;
    acceptedAt: string | null;
    condenserSnapshot: CondenserSnapshot | null;
  };
  items: BoardItem[];
  amendments: { id: number; itemId: number | null; author: string | null; at: string; reason: string; text: string }[];
  incomingCrew: { id: number; name: string; role: string }[];
  waiting: string[];
};
export type CurrentHandover = {
  shiftChange: { shiftStart: string; handoverAt: string; timeZone: string; outgoingCrewId: number | null; incomingCrewId: number | null };
  board: Board | null;
};

export const handoverKeys = {
  all: ['handover'] as const,
  current: (unitId: number) => [...handoverKeys.all, 'current', unitId] as const,
  one: (id: number) => [...handoverKeys.all, 'one', id] as const,
};

export const useCurrentHandover = (unitId: number | null) =>
  useQuery({ queryKey: handoverKeys.current(unitId ?? 0), queryFn: () => api.get<CurrentHandover>(`/api/units/${unitId}/handovers/current`), enabled: unitId !== null });
export const useHandover = (id: number) => useQuery({ queryKey: handoverKeys.one(id), queryFn: async () => (await api.get<{ board: Board }>(`/api/handovers/${id}`)).board });

type Action =
  | { kind: 'item'; id: number; body: { kind: string; title: string; detail?: string; reference?: string; priority: string } }
  | { kind: 'submit' | 'accept'; id: number }
  | { kind: 'amend'; id: number; body: { itemId?: number | null; reason: string; text: string } }
  | { kind: 'acknowledge'; itemId: number }
  | { kind: 'ask'; itemId: number; question: string }
  | { kind: 'answer'; queryId: number; answer: string };

export function useHandoverAction() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (a: Action) => {
      switch (a.kind) {
        case 'item':
          return api.post(`/api/handovers/${a.id}/items`, a.body);
        case 'submit':
        case 'accept':
          return api.post(`/api/handovers/${a.id}/${a.kind}`);
        case 'amend':
          return api.post(`/api/handovers/${a.id}/amendments`, a.body);
        case 'acknowledge':
          return api.post(`/api/handover-items/${a.itemId}/acknowledge`);
        case 'ask':
          return api.post(`/api/handover-items/${a.itemId}/queries`, { question: a.question });
        case 'answer':
          return api.post(`/api/handover-queries/${a.queryId}/answer`, { answer: a.answer });
      }
    },
    onSettled: () => void queryClient.invalidateQueries({ queryKey: handoverKeys.all }),
  });
}

export function useUploadAttachment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ itemId, file }: { itemId: number; file: File }) => {
      const form = new FormData();
      form.append('file', file);
      return api.upload(`/api/handover-items/${itemId}/attachments`, form);
    },
    onSettled: () => void queryClient.invalidateQueries({ queryKey: handoverKeys.all }),
  });
}

export const saveNotes = (id: number, html: string, version: number) => api.put<{ version: number }>(`/api/handovers/${id}/notes`, { html, version });
