import { PageHeader } from '@/components/layout/page-header';
import { UsagePage } from '@/features/usage';
import { RequirePermission } from './require-permission';

export default function UsageRoute() {
  return (
    <RequirePermission permission="usage:read" title="Usage">
      <PageHeader
        title="Usage"
        lead="Calls your keys and your playground made, by day and by endpoint, against your plan."
      />
      <UsagePage />
    </RequirePermission>
  );
}
