import { PageHeader } from '@/components/layout/page-header';
import { TeamPage } from '@/features/team';
import { RequirePermission } from './require-permission';

export default function TeamRoute() {
  return (
    <RequirePermission permission="team:manage" title="Team">
      <PageHeader title="Team" lead="People in your studio and what each may do." />
      <TeamPage />
    </RequirePermission>
  );
}
