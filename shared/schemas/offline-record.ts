import { z } from 'zod';
import './messages';

// A round or log entry kept on a device while it had no network carries these two fields: the
// device's id for the record (a retry returns the one already stored) and when it was entered.

/** How far ahead of the server's clock a device's clock may run before its time is refused. */
export const ENTERED_AT_CLOCK_SKEW_MS = 2 * 60 * 1000;
/** How long a record may wait on a device: a week covers an outage over a long weekend; older is written afresh. */
export const ENTERED_AT_MAX_AGE_DAYS = 7;

export const offlineRecordFields = {
  clientId: z.uuid({ message: 'The device’s record id is not valid; discard the record and write it again' }).optional(),
  enteredAt: z.iso.datetime({ offset: true, message: 'Not a valid time of entry' }).optional(),
};

/** The message beside `enteredAt` for a time the server refuses, or null when it is accepted. */
export function enteredAtProblem(enteredAt: Date, now: Date): string | null {
  if (Number.isNaN(enteredAt.getTime())) return 'Not a valid time of entry';
  if (enteredAt.getTime() > now.getTime() + ENTERED_AT_CLOCK_SKEW_MS) {
    return 'Entered in the future by this device’s clock: set the device’s date and time, then write the record again';
  }
  if (now.getTime() - enteredAt.getTime() > ENTERED_AT_MAX_AGE_DAYS * 86_400_000) {
    return `Entered more than ${ENTERED_AT_MAX_AGE_DAYS} days ago: a record kept on a device is taken for ${ENTERED_AT_MAX_AGE_DAYS} days; write it again now (as a late entry)`;
  }
  return null;
}

/** Arrived more than the station's late-entry minutes after it was entered. */
export const arrivedLate = (enteredAt: Date, receivedAt: Date, lateEntryMinutes: number) => receivedAt.getTime() - enteredAt.getTime() > lateEntryMinutes * 60_000;
