import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useChangePassword } from '../api/account';
import { PASSWORD_MIN, passwordChangeSchema, type PasswordChangeValues } from '../schemas';

const empty: PasswordChangeValues = { currentPassword: '', newPassword: '', confirm: '' };

/** Current and new password; the server ends the account's other sessions when it changes. */
export function PasswordSection() {
  const change = useChangePassword();
  const [formError, setFormError] = useState<string | null>(null);
  const [done, setDone] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<PasswordChangeValues>({
    resolver: zodResolver(passwordChangeSchema),
    defaultValues: empty,
  });

  const onSubmit = handleSubmit(async ({ currentPassword, newPassword }) => {
    setFormError(null);
    setDone(false);
    try {
      await change.mutateAsync({ currentPassword, newPassword });
      reset(empty);
      setDone(true);
    } catch (error) {
      setFormError(
        applyServerErrors(error, ['currentPassword', 'newPassword'], setError).formMessage,
      );
    }
  });

  return (
    <Card aria-labelledby="password-heading">
      <h2 id="password-heading" className="text-title font-semibold">
        Password
      </h2>
      <form noValidate onSubmit={onSubmit} className="mt-4 flex flex-col gap-4">
        <TextField
          label="Current password"
          type="password"
          autoComplete="current-password"
          error={errors.currentPassword?.message}
          {...register('currentPassword')}
        />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint={`At least ${PASSWORD_MIN} characters with 4 different ones; not a well-known password, your name or your email.`}
          error={errors.newPassword?.message}
          {...register('newPassword')}
        />
        <TextField
          label="Repeat the new password"
          type="password"
          autoComplete="new-password"
          error={errors.confirm?.message}
          {...register('confirm')}
        />
        {formError ? <Notice tone="fault">{formError}</Notice> : null}
        {done ? (
          <Notice tone="ok">
            Your password is changed. Your other browsers and devices were signed out; this one
            stays signed in.
          </Notice>
        ) : null}
        <div>
          <Button type="submit" disabled={isSubmitting}>
            Change password
          </Button>
        </div>
      </form>
    </Card>
  );
}
