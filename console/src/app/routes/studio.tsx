import { PageHeader } from '@/components/layout/page-header';
import { StudioPage } from '@/features/studio';
import { useCan } from '@/lib/session';
import { RequirePermission } from './require-permission';

export default function StudioRoute() {
  const owner = useCan('organization:manage');
  return (
    <RequirePermission permission="organization:read" title="Studio settings">
      <PageHeader
        title="Studio settings"
        lead={
          owner
            ? 'Your studio’s name, who owns it, and deleting it.'
            : 'Your studio’s name and plan. The owner changes them.'
        }
      />
      <StudioPage />
    </RequirePermission>
  );
}
