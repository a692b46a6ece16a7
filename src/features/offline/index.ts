// Offline rounds and log entries: the device's queue, the shell's indicator, the lists of what waits.
export { OfflineStatus } from './components/offline-status';
export { WaitingRecords } from './components/waiting-records';
export { sendOrKeep, discard, noteSignedInPerson } from './api/offline-store';
export type { QueuedRecord } from './api/queue';
export { forgetOfflineCopies } from './api/service-worker';
