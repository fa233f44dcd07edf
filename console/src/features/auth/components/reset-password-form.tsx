import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useConfirmPasswordReset } from '../api/password-reset';
import { PASSWORD_MIN, newPasswordSchema, type NewPasswordValues } from '../schemas';

export function ResetPasswordForm() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<NewPasswordValues>({ resolver: zodResolver(newPasswordSchema) });

  if (!token) {
    return (
      <Notice tone="fault">
        This link has no reset token. <Link to={paths.forgotPassword}>Ask for a new link</Link>.
      </Notice>
    );
  }

  const onSubmit = handleSubmit(async ({ password }) => {
    setFormError(null);
    try {
      await confirm.mutateAsync({ token, password });
    } catch (error) {
      setFormError(applyServerErrors(error, ['password'], setError).formMessage);
    }
  });

  if (confirm.isSuccess) {
    return (
      <Notice tone="ok">
        Your password is changed. <Link to={paths.signIn}>Sign in</Link> with the new one.
      </Notice>
    );
  }

  return (
    <Card>
      <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint={`At least ${PASSWORD_MIN} characters.`}
          error={errors.password?.message}
          {...register('password')}
        />
        <TextField
          label="Repeat the new password"
          type="password"
          autoComplete="new-password"
          error={errors.confirm?.message}
          {...register('confirm')}
        />
        {formError ? (
          <Notice tone="fault">
            {formError} <Link to={paths.forgotPassword}>Ask for a new link</Link>
          </Notice>
        ) : null}
        <Button type="submit" disabled={isSubmitting}>
          Set the password
        </Button>
      </form>
    </Card>
  );
}
