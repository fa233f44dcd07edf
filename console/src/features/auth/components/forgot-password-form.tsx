import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/password-reset';
import { forgotPasswordSchema, type ForgotPasswordValues } from '../schemas';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ForgotPasswordValues>({ resolver: zodResolver(forgotPasswordSchema) });

  const onSubmit = handleSubmit(async ({ email }) => {
    setFormError(null);
    try {
      await request.mutateAsync(email);
    } catch (error) {
      setFormError(applyServerErrors(error, ['email'], setError).formMessage);
    }
  });

  return (
    <>
      <Card>
        {request.isSuccess ? (
          <Notice tone="ok">
            If an account uses that address, a link to choose a new password is on its way. It works
            once and expires soon.
          </Notice>
        ) : (
          <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
            <TextField
              label="Email"
              type="email"
              autoComplete="email"
              error={errors.email?.message}
              {...register('email')}
            />
            {formError ? <Notice tone="fault">{formError}</Notice> : null}
            <Button type="submit" disabled={isSubmitting}>
              Send the link
            </Button>
          </form>
        )}
      </Card>
      <p className="mt-4 text-small text-ink-muted">
        <Link to={paths.signIn}>Back to sign in</Link>
      </p>
    </>
  );
}
