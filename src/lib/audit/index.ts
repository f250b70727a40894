export { recordAudit, type AuditAction, type AuditEntry } from './record';
export { actionInWords, AUDIT_ACTION_LABELS, summariseDetails } from './labels';
export { csvCell, csvRow } from './csv';
export { AUDIT_PAGE_SIZE, AuditFilterSchema, auditActionsOf, auditEventBatches, listAuditEvents, type AuditFilter, type AuditRow } from './query';
