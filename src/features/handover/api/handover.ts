import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { invalidateForChange } from '../../../app/live-keys';
import type { CondenserSnapshot } from '../../../../shared/shift-condenser';
import { api } from '../../../lib/api-client';
import type { z } from 'zod';
import type { editHandoverItemSchema, handoverAmendmentSchema, newHandoverItemSchema } from '../../../../shared/schemas/handovers';
import { handoverKeys } from './handover-keys';
export { handoverKeys };

export type BoardItem = {
  id: number;
  kind: string;
  title: string;
  detail: string | null;
  reference: string | null;
  priority: 'low' | 'normal' | 'high';
  sourceId: number | null;
  /** Attached by the handover itself (a flag, condition, log entry or order); follows its source. */
  automatic: boolean;
  addedBy: string | null;
  version: number;
  amendedAt: string | null;
  live: { state: string; remainingMs: number | null } | null;
  attachments: { id: number; fileName: string; mime: string; size: number; amendmentId: number | null; uploadedAt: string }[];
  acknowledgedBy: { userId: number; name: string | null; at: string }[];
  /** Acknowledged before the item was amended: must acknowledge again. */
  acknowledgedEarlierVersion: { userId: number; name: string | null; at: string }[];
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
    startedBy: string | null;
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
export type ShiftChange = {
  shiftStart: string;
  handoverAt: string;
  timeZone: string;
  outgoingCrewId: number | null;
  incomingCrewId: number | null;
  windowOpensAt: string;
  windowClosesAt: string;
};
export type CurrentHandover = { shiftChange: ShiftChange; mayStart: boolean; board: Board | null };


export const useCurrentHandover = (unitId: number | null) =>
  useQuery({ queryKey: handoverKeys.current(unitId ?? 0), queryFn: () => api.get<CurrentHandover>(`/api/units/${unitId}/handovers/current`), enabled: unitId !== null });
export const useHandover = (id: number) => useQuery({ queryKey: handoverKeys.one(id), queryFn: async () => (await api.get<{ board: Board }>(`/api/handovers/${id}`)).board });

/**
 * A key for one thing the person means to create: kept while they retry, new after it succeeded.
 * The server makes one record per key, so a double click or a retry after a lost answer is harmless.
 */
export function useClientKey(): [string, () => void] {
  const [key, setKey] = useState(() => crypto.randomUUID());
  return [key, () => setKey(crypto.randomUUID())];
}

type NewItem = z.output<typeof newHandoverItemSchema>;
type EditItem = z.output<typeof editHandoverItemSchema>;
type Amendment = z.output<typeof handoverAmendmentSchema>;

export type HandoverAction =
  | { kind: 'start' }
  | { kind: 'item'; id: number; body: NewItem }
  | { kind: 'edit-item'; itemId: number; body: EditItem }
  | { kind: 'remove-item'; itemId: number }
  | { kind: 'submit' | 'accept'; id: number }
  | { kind: 'amend'; id: number; body: Amendment }
  | { kind: 'acknowledge'; itemId: number }
  | { kind: 'ask'; itemId: number; question: string; clientKey?: string | undefined }
  | { kind: 'answer'; queryId: number; answer: string };

function send(unitId: number, a: HandoverAction) {
  switch (a.kind) {
    case 'start':
      return api.post(`/api/units/${unitId}/handovers/current`);
    case 'item':
      return api.post(`/api/handovers/${a.id}/items`, a.body);
    case 'edit-item':
      return api.patch(`/api/handover-items/${a.itemId}`, a.body);
    case 'remove-item':
      return api.delete(`/api/handover-items/${a.itemId}`);
    case 'submit':
    case 'accept':
      return api.post(`/api/handovers/${a.id}/${a.kind}`);
    case 'amend':
      return api.post(`/api/handovers/${a.id}/amendments`, a.body);
    case 'acknowledge':
      return api.post(`/api/handover-items/${a.itemId}/acknowledge`);
    case 'ask':
      return api.post(`/api/handover-items/${a.itemId}/queries`, { question: a.question, clientKey: a.clientKey });
    case 'answer':
      return api.post(`/api/handover-queries/${a.queryId}/answer`, { answer: a.answer });
  }
}

/**
 * Every change on the board; the person who made it sees it at once, the others through the live
 * event. One at a time per control: a second click while the first is on its way is dropped, so a
 * double click neither sends twice nor shows the second one's "already done" as an error.
 */
export function useHandoverAction(unitId: number) {
  const queryClient = useQueryClient();
  const busy = useRef(false);
  const mutation = useMutation({
    mutationFn: (a: HandoverAction) => send(unitId, a),
    onSettled: () => {
      busy.current = false;
      invalidateForChange(queryClient, { entity: 'handover', id: 0, unitId });
    },
  });
  const mutate: typeof mutation.mutate = (action, options) => {
    if (busy.current) return;
    busy.current = true;
    mutation.mutate(action, options);
  };
  const mutateAsync = async (action: HandoverAction) => {
    if (busy.current) return undefined;
    busy.current = true;
    return mutation.mutateAsync(action);
  };
  return { ...mutation, mutate, mutateAsync };
}

export function useUploadAttachment(unitId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ itemId, file, reason }: { itemId: number; file: File; reason?: string }) => {
      const form = new FormData();
      if (reason) form.append('reason', reason);
      form.append('file', file);
      return api.upload(`/api/handover-items/${itemId}/attachments`, form);
    },
    onSettled: () => invalidateForChange(queryClient, { entity: 'handover', id: 0, unitId }),
  });
}

export const saveNotes = (id: number, html: string, version: number) => api.put<{ version: number }>(`/api/handovers/${id}/notes`, { html, version });
