import { PageHeader } from '@/components/layout/page-header';
import { ConfirmEmail } from '@/features/auth';

export default function ConfirmEmailRoute() {
  return (
    <>
      <PageHeader title="Confirm your new e-mail address" />
      <ConfirmEmail />
    </>
  );
}
