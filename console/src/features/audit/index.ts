export { AuditLog } from './components/audit-log';
