import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { useSignUp } from '../api/sign-up';
import { PASSWORD_MIN, signUpSchema, type SignUpValues } from '../schemas';

const fields = ['name', 'organizationName', 'email', 'password'] as const;

export function SignUpForm() {
  const navigate = useNavigate();
  const signUp = useSignUp();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignUpValues>({ resolver: zodResolver(signUpSchema) });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await signUp.mutateAsync(values);
      await navigate(paths.overview, { replace: true });
    } catch (error) {
      setFormError(applyServerErrors(error, fields, setError).formMessage);
    }
  });

  return (
    <>
      <Card>
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
          <TextField
            label="Your name"
            autoComplete="name"
            error={errors.name?.message}
            {...register('name')}
          />
          <TextField
            label="Studio name"
            autoComplete="organization"
            error={errors.organizationName?.message}
            {...register('organizationName')}
          />
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
            autoComplete="new-password"
            hint={`At least ${PASSWORD_MIN} characters; very common passwords are refused.`}
            error={errors.password?.message}
            {...register('password')}
          />
          {formError ? <Notice tone="fault">{formError}</Notice> : null}
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? 'Creating…' : 'Create account'}
          </Button>
        </form>
      </Card>
      <p className="mt-4 text-small text-ink-muted">
        Already have an account? <Link to={paths.signIn}>Sign in</Link>
      </p>
    </>
  );
}
