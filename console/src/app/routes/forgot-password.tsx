import { PageHeader } from '@/components/layout/page-header';
import { ForgotPasswordForm } from '@/features/auth';

export default function ForgotPasswordRoute() {
  return (
    <>
      <PageHeader
        title="Forgot your password?"
        lead="We’ll e-mail you a link to choose a new one."
      />
      <ForgotPasswordForm />
    </>
  );
}
