// The handover board: keys for the live-update map and its pages, loaded on demand (the board does not load charts).
export { handoverKeys } from './api/handover-keys';
export { shiftCondenserKeys } from './api/shift-condenser-keys';
export const loadHandoverPage = async () => (await import('./routes/handover-page')).HandoverPage;
export const loadHandoverPrintPage = async () => (await import('./routes/print-page')).HandoverPrintPage;
