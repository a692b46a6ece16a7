// The audit trail: its keys (a change to people shows in it) and its page, loaded on demand.
export { auditKeys } from './api/audit-keys';
export const loadAuditPage = async () => (await import('./routes/audit-page')).AuditPage;
