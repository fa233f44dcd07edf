import { zodResolver } from '@hookform/resolvers/zod';
import { useMemo, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Dialog } from '@/components/ui/dialog';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import type { Session } from '@/lib/session';
import { useDeleteStudio } from '../api/studio';
import { deleteStudioSchema, type DeleteStudioValues } from '../schemas';

const lost = [
  'every member’s access to it (their own accounts stay)',
  'every API key: apps using them are refused at once',
  'pending invitations',
  'saved setups, the gear list and test frames',
  'usage history and the audit log',
];

/** Deleting the studio (owner only): what goes, then the studio's name typed to confirm. */
export function DeleteStudio({ organization }: { organization: Session['organization'] }) {
  const [open, setOpen] = useState(false);
  return (
    <Card aria-labelledby="delete-heading" className="border-fault">
      <h2 id="delete-heading" className="text-title font-semibold">
        Delete studio
      </h2>
      <p className="mt-1 text-small text-ink-muted">Deleting cannot be undone. It removes:</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-small">
        {lost.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
      <Button variant="danger" className="mt-4" onClick={() => setOpen(true)}>
        Delete studio
      </Button>
      {open ? <DeleteDialog organization={organization} onClose={() => setOpen(false)} /> : null}
    </Card>
  );
}

function DeleteDialog({
  organization,
  onClose,
}: {
  organization: Session['organization'];
  onClose: () => void;
}) {
  const remove = useDeleteStudio();
  const navigate = useNavigate();
  const [formError, setFormError] = useState<string | null>(null);
  const schema = useMemo(() => deleteStudioSchema(organization.name), [organization.name]);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<DeleteStudioValues>({
    resolver: zodResolver(schema),
    defaultValues: { confirmName: '' },
  });
  const matches = useWatch({ control, name: 'confirmName' }) === organization.name;

  const onSubmit = handleSubmit(async ({ confirmName }) => {
    setFormError(null);
    try {
      await remove.mutateAsync(confirmName);
      // A fixed message on the sign-in page: the address never carries text it would show.
      void navigate(`${paths.signIn}?deleted=studio`, { replace: true });
    } catch (error) {
      // A 409 (a running subscription, or records still tied to the studio) has no form field:
      // its detail shows above the buttons.
      setFormError(applyServerErrors(error, ['confirmName'], setError).formMessage);
    }
  });

  return (
    <Dialog
      open
      onClose={onClose}
      title={`Delete ${organization.name}?`}
      description="The studio and everything in it are deleted for good, and you are signed out."
    >
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
        {organization.planCode !== 'free' ? (
          <Notice tone="caution">
            The studio is on the {organization.planCode} plan. Cancel the subscription on the{' '}
            <Link to={paths.billing}>Billing</Link> page first: a studio with a running subscription
            cannot be deleted.
          </Notice>
        ) : null}
        <TextField
          label={`Type “${organization.name}” to confirm`}
          autoComplete="off"
          spellCheck={false}
          error={errors.confirmName?.message}
          {...register('confirmName')}
        />
        {formError ? <Notice tone="fault">{formError}</Notice> : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="secondary" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" variant="danger" disabled={!matches || isSubmitting}>
            {isSubmitting ? 'Deleting…' : 'Delete studio'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
