import { PageHeader } from '@/components/layout/page-header';
import { useKeyLabels, type KeyLabel } from '@/features/keys';
import { UsagePage } from '@/features/usage';
import { useCan } from '@/lib/session';
import { RequirePermission } from './require-permission';

const NO_KEYS: KeyLabel[] = [];

export default function UsageRoute() {
  const keys = useKeyLabels(useCan('keys:manage-own'));
  return (
    <RequirePermission permission="usage:read" title="Usage">
      <PageHeader
        title="Usage"
        lead="Calls your keys and your playground made, by day and by endpoint, against your plan."
      />
      <UsagePage keys={keys.data ?? NO_KEYS} />
    </RequirePermission>
  );
}
