// The log feature as other features see it: import from here, never from its files.
export { LogAmendment, LogEntry } from './model';
export { type LogService, listEntries, reviewsFor } from './service';
