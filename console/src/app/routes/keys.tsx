import { PageHeader } from '@/components/layout/page-header';
import { KeysPage } from '@/features/keys';
import { RequirePermission } from './require-permission';

export default function KeysRoute() {
  return (
    <RequirePermission permission="keys:manage-own" title="Keys">
      <PageHeader
        title="Keys"
        lead="API keys let your apps call Lumenwright; each key belongs to your studio."
      />
      <KeysPage />
    </RequirePermission>
  );
}
