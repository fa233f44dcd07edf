import { PageHeader } from '@/components/layout/page-header';
import { SignUpForm } from '@/features/auth';

export default function SignUpRoute() {
  return (
    <>
      <PageHeader
        title="Create a studio account"
        lead="One account per studio; invite your team later."
      />
      <SignUpForm />
    </>
  );
}
