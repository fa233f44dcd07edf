import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignIn } from '../api/sign-in';
import { safeNext } from '../redirect';
import { signInSchema, type SignInValues } from '../schemas';

export function SignInForm() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    setFocus,
    formState: { errors, isSubmitting },
  } = useForm<SignInValues>({ resolver: zodResolver(signInSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signIn.mutateAsync(values);
      await navigate(safeNext(params.get('next')), { replace: true });
    } catch (error) {
      const result = applyServerErrors(error, ['email', 'password'], setError);
      setFormError(result.formMessage);
      // Back to the password (selected) for another try, rather than nowhere: the submit
      // button was disabled while waiting, which drops focus to the page.
      if (!result.placed.includes('email')) setFocus('password', { shouldSelect: true });
    }
  });

  return (
    <>
      <Card>
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
          {params.get('deleted') === 'studio' ? (
            <Notice tone="ok">
              The studio was deleted. Sign in again to reach any other studio you belong to.
            </Notice>
          ) : null}
          <TextField
            label="Email"
            type="email"
            autoComplete="email"
            error={errors.email?.message}
            {...register('email')}
          />
          <TextField
            label="Password"
            type="password"
            autoComplete="current-password"
            error={errors.password?.message}
            {...register('password')}
          />
          {formError ? <Notice tone="fault">{formError}</Notice> : null}
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? 'Signing in…' : 'Sign in'}
          </Button>
        </form>
      </Card>
      <p className="mt-4 text-small text-ink-muted">
        <Link to={paths.forgotPassword}>Forgot your password?</Link>
      </p>
      <p className="mt-2 text-small text-ink-muted">
        New here? <Link to={paths.signUp}>Create a studio account</Link>
      </p>
    </>
  );
}
