import { zodResolver } from '@hookform/resolvers/zod';
import { useId, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { seatsFull, useCreateInvite, type Seats } from '../api/team';
import { roleOptions } from './roles';
import { SeatsFullNotice } from './seats-notice';

export const inviteSchema = z.object({
  email: z.email('Enter the address to send the invitation to'),
  role: z.enum(['owner', 'admin', 'developer', 'photographer']),
});
type InviteValues = z.infer<typeof inviteSchema>;

interface InviteFormProps {
  canGrantOwner: boolean;
  /** The plan's seats and how many are taken; while unknown the server alone decides. */
  seats?: Seats;
}

export function InviteForm({ canGrantOwner, seats }: InviteFormProps) {
  const create = useCreateInvite();
  const fullId = useId();
  const full = seats ? seatsFull(seats) : false;
  const [formError, setFormError] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    control,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<InviteValues>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: '', role: 'photographer' },
  });

  const role = useWatch({ control, name: 'role' });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSentTo(null);
    try {
      await create.mutateAsync(values);
      setSentTo(values.email);
      reset();
    } catch (error) {
      setFormError(applyServerErrors(error, ['email', 'role'], setError).formMessage);
    }
  });

  return (
    <form
      noValidate
      onSubmit={onSubmit}
      className="grid grid-cols-[minmax(0,1fr)] gap-4 sm:grid-cols-[2fr_minmax(0,1fr)_auto] sm:items-start"
    >
      <TextField label="Email" type="email" error={errors.email?.message} {...register('email')} />
      <SelectField
        className="min-w-0"
        label="Role"
        options={roleOptions(canGrantOwner)}
        error={errors.role?.message}
        // Held by value, so the select can never drift to its first option (owner) unseen.
        value={role}
        {...register('role')}
      />
      <Button
        type="submit"
        disabled={isSubmitting || full}
        aria-describedby={full ? fullId : undefined}
        className="sm:mt-6"
      >
        Send invitation
      </Button>
      {seats && full ? (
        <div className="sm:col-span-3">
          <SeatsFullNotice seats={seats} id={fullId} />
        </div>
      ) : null}
      {formError ? (
        <Notice tone="fault" className="sm:col-span-3">
          {formError}
        </Notice>
      ) : null}
      {sentTo ? (
        <Notice tone="ok" className="sm:col-span-3">
          Invitation sent to {sentTo}. The link is valid for 7 days.
        </Notice>
      ) : null}
    </form>
  );
}
