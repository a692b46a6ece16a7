import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { BoardPresence, LiveEvent } from '../../shared/live-events';
import { closeSocket, getSocket } from '../lib/socket';
import { invalidateEverything, invalidateForChange } from './live-keys';
import { announceChange } from './live-announcer';

/** Sockets notify, queries fetch: invalidate on each event, and everything after a reconnect. */
export function useLiveUpdates(signedIn: boolean) {
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!signedIn) return;
    const socket = getSocket();
    const onChanged = (event: LiveEvent) => {
      invalidateForChange(queryClient, event);
      announceChange(event);
    };
    let connectedBefore = false;
    const onConnect = () => {
      // Rooms are per connection: join again what this tab watches, then catch up on what was missed.
      rejoin();
      if (connectedBefore) invalidateEverything(queryClient);
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

// How many mounted pages of this tab watch each unit, and have its board open. A unit is left
// when the last page that watched it unmounts.
const watching = new Map<number, number>();
const onBoard = new Map<number, number>();

function rejoin() {
  const socket = getSocket();
  for (const unitId of watching.keys()) socket.emit('watch-unit', unitId);
  for (const unitId of onBoard.keys()) socket.emit('open-board', unitId);
}

function hold(counts: Map<number, number>, unitId: number, join: string, leave: string) {
  const socket = getSocket();
  const before = counts.get(unitId) ?? 0;
  counts.set(unitId, before + 1);
  if (before === 0 && socket.connected) socket.emit(join, unitId);
  return () => {
    const now = (counts.get(unitId) ?? 1) - 1;
    if (now > 0) counts.set(unitId, now);
    else {
      counts.delete(unitId);
      if (socket.connected) socket.emit(leave, unitId);
    }
  };
}

/** Joins the unit's room while the page is shown, so its events reach this tab; leaves on unmount. */
export function useWatchUnit(unitId: number | null) {
  useEffect(() => (unitId ? hold(watching, unitId, 'watch-unit', 'unwatch-unit') : undefined), [unitId]);
}

/** Watches several units at once (the overview). */
export function useWatchUnits(unitIds: number[]) {
  const key = [...unitIds].sort((a, b) => a - b).join(',');
  useEffect(() => {
    const releases = key ? key.split(',').map((id) => hold(watching, Number(id), 'watch-unit', 'unwatch-unit')) : [];
    return () => releases.forEach((release) => release());
  }, [key]);
}

/** Marks this person as on the unit's handover board and returns who else is on it now. */
export function useBoardPresence(unitId: number | null): string[] {
  const [presence, setPresence] = useState<BoardPresence | null>(null);
  useEffect(() => {
    if (!unitId) return;
    const socket = getSocket();
    const onPresence = (p: BoardPresence) => {
      if (p.unitId === unitId) setPresence(p);
    };
    socket.on('presence', onPresence);
    const release = hold(onBoard, unitId, 'open-board', 'close-board');
    return () => {
      socket.off('presence', onPresence);
      release();
    };
  }, [unitId]);
  return presence && presence.unitId === unitId ? presence.people : [];
}

const FIRST_CONNECT_GRACE_MS = 10_000;

/**
 * Whether this tab is hearing the server: false while the browser is offline or the live connection
 * is down (after a short grace, so a reconnect does not flash a warning).
 */
export function useConnected(signedIn: boolean): boolean {
  const [connected, setConnected] = useState(true);
  useEffect(() => {
    if (!signedIn) return;
    const socket = getSocket();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const update = () => {
      clearTimeout(timer);
      const up = navigator.onLine && socket.connected;
      if (up) setConnected(true);
      else timer = setTimeout(() => setConnected(navigator.onLine && socket.connected), 3000);
    };
    socket.on('connect', update);
    socket.on('disconnect', update);
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    // A connection that never comes up (its client could not be fetched, the server is unreachable) sends
    // no event: look once after a grace long enough for a slow link to load the client and connect.
    const firstLook = setTimeout(() => setConnected(navigator.onLine && socket.connected), FIRST_CONNECT_GRACE_MS);
    return () => {
      clearTimeout(firstLook);
      clearTimeout(timer);
      socket.off('connect', update);
      socket.off('disconnect', update);
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, [signedIn]);
  return connected;
}
