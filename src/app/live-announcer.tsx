// One polite live region for the whole app: changes made by others that a person should hear of
// without looking (a flag on the unit, the handover board moving on) are read out by a screen reader
// when it is idle, never interrupting. Fed from the live-update socket (use-live-updates.ts).
import { useSyncExternalStore } from 'react';
import type { LiveEvent } from '../../shared/live-events';

let message = '';
const listeners = new Set<() => void>();

/** Says `text` through the live region; the same text twice is said twice. */
export function announce(text: string) {
  // A region whose text does not change is not read again: a trailing no-break space makes it new.
  message = message === text ? `${text}\u00a0` : text;
  for (const listener of listeners) listener();
}

/**
 * What a live event is worth saying. The event names only the kind of record and the unit (the
 * page refetches the rest), so the words say what changed, not how.
 */
export function announcementFor(event: LiveEvent): string | null {
  switch (event.entity) {
    case 'flag':
      return 'Flags changed on the unit you are watching: a flag was raised, escalated, assigned or cleared.';
    case 'handover':
      return 'The handover board changed: an item, an acknowledgement, a question or its status.';
    default:
      return null;
  }
}

export function announceChange(event: LiveEvent) {
  const text = announcementFor(event);
  if (text) announce(text);
}

const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => listeners.delete(listener);
};

/** The region itself: rendered once, around the router, out of sight. */
export function LiveAnnouncer() {
  const text = useSyncExternalStore(subscribe, () => message, () => '');
  return (
    <div className="sr-only" role="status" aria-live="polite" aria-atomic="true" data-testid="live-announcer">
      {text}
    </div>
  );
}
