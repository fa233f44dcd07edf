import { PageHeader } from '@/components/layout/page-header';
import { AcceptInvite } from '@/features/auth';

export default function AcceptInviteRoute() {
  return (
    <>
      <PageHeader title="Join a studio" />
      <AcceptInvite />
    </>
  );
}
