import { PageHeader } from '@/components/layout/page-header';
import { SignInForm } from '@/features/auth';

export default function SignInRoute() {
  return (
    <>
      <PageHeader title="Sign in" lead="Open your studio’s console." />
      <SignInForm />
    </>
  );
}
