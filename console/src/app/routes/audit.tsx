import { PageHeader } from '@/components/layout/page-header';
import { AuditLog } from '@/features/audit';
import { RequirePermission } from './require-permission';

export default function AuditRoute() {
  return (
    <RequirePermission permission="audit:read" title="Audit">
      <PageHeader
        title="Audit"
        lead="Sign-ins, keys, roles and invitations: who did what, when, and from where."
      />
      <AuditLog />
    </RequirePermission>
  );
}
