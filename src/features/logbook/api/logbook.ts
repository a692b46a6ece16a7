import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Evaluation } from '../../../../shared/calc/evaluate';
import type { LimitSet } from '../../../../shared/calc/limits';
import type { CondenserSnapshot } from '../../../../shared/shift-condenser';
import { api } from '../../../lib/api-client';
import type { ReviewCommentView, SearchHit } from '../../../../shared/schemas/logbook';
import { logbookKeys } from './logbook-keys';
export { logbookKeys };

export type { ReviewCommentView, SearchHit };

export type SearchFilters = {
  q: string;
  unitId?: string;
  crewId?: string;
  personId?: string;
  kind?: string;
  severity?: string;
  from?: string;
  to?: string;
  page: number;
};


export function searchParams(filters: SearchFilters, pageSize = 25) {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') params.set(key, String(value));
  params.set('pageSize', String(pageSize));
  return params;
}

export const useLogbookSearch = (filters: SearchFilters, enabled: boolean) =>
  useQuery({
    queryKey: logbookKeys.search(filters),
    queryFn: () => api.get<{ hits: SearchHit[]; total: number; page: number; pageSize: number; words: string[] }>(`/api/logbook/search?${searchParams(filters)}`),
    enabled,
    placeholderData: keepPreviousData,
  });

type HandoverBoard = {
  handover: {
    id: number;
    shiftStart: string;
    handoverAt: string;
    notesHtml: string;
    status: string;
    submittedBy: string | null;
    submittedAt: string | null;
    acceptedBy: string | null;
    acceptedAt: string | null;
    condenserSnapshot: CondenserSnapshot | null;
  };
  items: {
    id: number;
    kind: string;
    title: string;
    detail: string | null;
    reference: string | null;
    priority: string;
    attachments: { id: number; fileName: string; mime: string; size: number }[];
    acknowledgedBy: { name: string | null; at: string }[];
    queries: { id: number; question: string; askedBy: string | null; askedAt: string; answer: string | null; answeredBy: string | null; answeredAt: string | null }[];
  }[];
  amendments: { id: number; itemId: number | null; author: string | null; at: string; reason: string; text: string }[];
};

export type PastShift = {
  unit: { id: number; name: string };
  shift: { start: string; end: string; startLocal: string; endLocal: string; timeZone: string; crew: { id: number; name: string } | null; inProgress: boolean; asAt: string };
  logEntries: {
    id: number;
    position: string;
    category: string;
    eventAt: string;
    enteredAt: string;
    late: boolean;
    author: string;
    writtenAsTrainee: boolean;
    text: string;
    amendments: { id: number; author: string; amendedAt: string; reason: string; text: string }[];
  }[];
  reviews: { position: string; by: string; at: string }[];
  readings: {
    reading: { id: number; takenAt: string; recordedBy: string; recordedAsTrainee: boolean; worstStatus: string; limitVersionId: number };
    amendments: { id: number; amendedAt: string; amendedBy: string; reason: string }[];
    current: { results: Evaluation; worstStatus: string; amended: boolean };
    countersign: { by: string; at: string } | null;
    limitSet: { id: number; effectiveFrom: string; limits: LimitSet } | null;
  }[];
  flags: { id: number; parameterLabel: string; severity: string; origin: string; statusThen: string; raisedAt: string; raisedBy: string | null; comment: string | null; clearedAt: string | null; clearComment: string | null }[];
  conditions: { id: number; title: string; requiredAction: string; startedAt: string; limitLocal: string; state: string; remainingMs: number | null; owner: string; closedAt: string | null }[];
  standingOrders: { id: number; title: string; bodyHtml: string; issuedBy: string; issuedAt: string }[];
  handoverReceived: HandoverBoard | null;
  handoverGiven: HandoverBoard | null;
  documents: { id: number; kind: string; refId: number }[];
  comments: ReviewCommentView[];
};

export const usePastShift = (unitId: number, shiftStart: string) =>
  useQuery({ queryKey: logbookKeys.shift(unitId, shiftStart), queryFn: () => api.get<PastShift>(`/api/logbook/units/${unitId}/shifts/${encodeURIComponent(shiftStart)}`) });

export const useMyReviewComments = (enabled = true) =>
  useQuery({ queryKey: logbookKeys.myComments(), queryFn: async () => (await api.get<{ comments: ReviewCommentView[] }>('/api/logbook/review-comments/mine')).comments, enabled });

export function useAddReviewComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: { documentId: number; body: string }) => (await api.post<{ comment: ReviewCommentView }>('/api/logbook/review-comments', input)).comment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: logbookKeys.all }),
  });
}

/** Where a search hit opens: its shift, on its unit (station-wide records on the chosen or first unit). */
export function shiftLink(hit: Pick<SearchHit, 'unitId' | 'shiftStart' | 'documentId'>, fallbackUnitId: number | null) {
  const unitId = hit.unitId ?? fallbackUnitId;
  if (!unitId || !hit.shiftStart) return null;
  return `/logbook/units/${unitId}/shifts/${encodeURIComponent(hit.shiftStart)}#record-${hit.documentId}`;
}
