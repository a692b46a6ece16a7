import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { closeSocket, getSocket } from '../lib/socket';

type Changed = { entity: string; id: number | string; unitId?: number };

// Which cached queries each kind of change makes stale.
const keysFor: Record<string, string[][]> = {
  log_entry: [['log']],
  log_review: [['log']],
  condition: [['conditions'], ['log']],
  standing_order: [['orders'], ['pending-orders']],
  handover: [['handover']],
  review_comment: [['logbook']],
};

/** Sockets notify, queries fetch: invalidate on each event, and everything after a reconnect. */
export function useLiveUpdates(signedIn: boolean) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!signedIn) return;
    const socket = getSocket();
    const onChanged = (event: Changed) => {
      for (const queryKey of keysFor[event.entity] ?? []) void queryClient.invalidateQueries({ queryKey });
    };
    let connectedBefore = false;
    const onConnect = () => {
      if (connectedBefore) void queryClient.invalidateQueries();
      connectedBefore = true;
    };
    socket.on('changed', onChanged);
    socket.on('connect', onConnect);
    return () => {
      socket.off('changed', onChanged);
      socket.off('connect', onConnect);
      closeSocket();
    };
  }, [signedIn, queryClient]);
}

/** Joins the unit's room so its events reach this tab. */
export function useWatchUnit(unitId: number | null) {
  useEffect(() => {
    if (!unitId) return;
    const socket = getSocket();
    const join = () => socket.emit('watch-unit', unitId);
    join();
    socket.on('connect', join);
    return () => {
      socket.off('connect', join);
    };
  }, [unitId]);
}

/** Names of the people who have this unit open right now. */
export function usePresence(unitId: number | null): string[] {
  const [people, setPeople] = useState<string[]>([]);
  useEffect(() => {
    if (!unitId) return;
    const socket = getSocket();
    const onPresence = (p: { unitId: number; people: string[] }) => {
      if (p.unitId === unitId) setPeople(p.people);
    };
    socket.on('presence', onPresence);
    return () => {
      socket.off('presence', onPresence);
    };
  }, [unitId]);
  return people;
}
