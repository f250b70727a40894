export { recordAudit, type AuditAction, type AuditEntry } from './record';
