import { PageHeader } from '@/components/layout/page-header';
import { BillingPage } from '@/features/billing';
import { RequirePermission } from './require-permission';

export default function BillingRoute() {
  return (
    <RequirePermission permission="billing:manage" title="Billing">
      <PageHeader title="Billing" lead="Your plan, its limits and your invoices." />
      <BillingPage />
    </RequirePermission>
  );
}
