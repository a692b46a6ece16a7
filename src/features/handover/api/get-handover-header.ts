import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { handoverKeys } from './handover';

type CrewOnRecord = { id: number; name: string; members: { name: string; role: string }[] } | null;
export type HandoverHeader = {
  station: { id: number; name: string };
  unit: { id: number; name: string };
  timeZone: string;
  shiftStartLocal: string;
  handoverAtLocal: string;
  outgoingCrew: CrewOnRecord;
  incomingCrew: CrewOnRecord;
};

/** Under `handoverKeys.all`, so whatever refreshes a handover refreshes its header too. */
export const handoverHeaderKeys = { one: (id: number) => [...handoverKeys.all, 'header', id] as const };

export const handoverHeaderQueryOptions = (id: number) =>
  queryOptions({ queryKey: handoverHeaderKeys.one(id), queryFn: async () => (await api.get<{ header: HandoverHeader }>(`/api/handovers/${id}/header`)).header });

export const useHandoverHeader = (id: number) => useQuery(handoverHeaderQueryOptions(id));
