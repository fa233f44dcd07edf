import { PageHeader } from '@/components/layout/page-header';
import { AccountPage } from '@/features/account';

export default function AccountRoute() {
  return (
    <>
      <PageHeader
        title="Account"
        lead="Your name, sign-in email and password, the studios you belong to, and your sessions."
      />
      <AccountPage />
    </>
  );
}
