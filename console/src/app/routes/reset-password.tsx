import { PageHeader } from '@/components/layout/page-header';
import { ResetPasswordForm } from '@/features/auth';

export default function ResetPasswordRoute() {
  return (
    <>
      <PageHeader title="Choose a new password" />
      <ResetPasswordForm />
    </>
  );
}
