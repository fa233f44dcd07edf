import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { paths } from '@/config/paths';
import { problemMessage } from '@/lib/form-errors';
import { useSignOutEverywhere } from '../api/account';

/** Ends every session of the account (a lost phone, a shared computer), after asking. */
export function SignOutEverywhere() {
  const [open, setOpen] = useState(false);
  const signOut = useSignOutEverywhere();
  const navigate = useNavigate();

  const close = () => {
    setOpen(false);
    signOut.reset();
  };
  const confirm = () =>
    signOut.mutate(undefined, {
      onSuccess: () => void navigate(paths.signIn, { replace: true }),
    });

  return (
    <Card aria-labelledby="sessions-heading">
      <h2 id="sessions-heading" className="text-title font-semibold">
        Sessions
      </h2>
      <p className="mt-1 text-small text-ink-muted">
        Left the console open on a shared computer or lost a device? Sign out of every browser at
        once. API keys are not sessions: they keep working.
      </p>
      <Button variant="danger" className="mt-4" onClick={() => setOpen(true)}>
        Sign out everywhere
      </Button>
      <ConfirmDialog
        open={open}
        onClose={close}
        title="Sign out everywhere?"
        description="Every session of your account ends, this one included: you will sign in again on each browser and device you use."
        confirmLabel="Sign out everywhere"
        onConfirm={confirm}
        pending={signOut.isPending}
        error={signOut.isError ? problemMessage(signOut.error) : null}
      />
    </Card>
  );
}
