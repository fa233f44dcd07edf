import { useSession } from '@/lib/session';
import { EmailSection } from './email-section';
import { PasswordSection } from './password-section';
import { ProfileSection } from './profile-section';
import { SignOutEverywhere } from './sign-out-everywhere';
import { StudiosSection } from './studios-section';

/** The signed-in person's own settings; every role has this page (`profile:manage`). */
export function AccountPage() {
  const session = useSession();
  if (!session) return null;
  return (
    <div className="grid min-w-0 gap-6 lg:grid-cols-2">
      <ProfileSection session={session} />
      <EmailSection currentEmail={session.user.email} />
      <PasswordSection />
      <div className="flex min-w-0 flex-col gap-6">
        <StudiosSection />
        <SignOutEverywhere />
      </div>
    </div>
  );
}
