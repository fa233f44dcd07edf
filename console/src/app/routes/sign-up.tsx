import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { PageHeader } from '@/components/layout/page-header';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';

const signUpSchema = z.object({
  studio: z.string().trim().min(2, 'Give your studio a name of at least 2 characters').max(80),
  email: z.email('Enter a valid email address'),
  password: z.string().min(12, 'Use at least 12 characters').max(200),
});
type SignUpValues = z.infer<typeof signUpSchema>;

export default function SignUpRoute() {
  const [notice, setNotice] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SignUpValues>({ resolver: zodResolver(signUpSchema) });

  const onSubmit = handleSubmit(() =>
    setNotice('Creating accounts is not connected to the server yet.'),
  );

  return (
    <>
      <PageHeader
        title="Create a studio account"
        lead="One account per studio; invite your team later."
      />
      <Card>
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
          <TextField
            label="Studio name"
            autoComplete="organization"
            error={errors.studio?.message}
            {...register('studio')}
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
            hint="At least 12 characters."
            error={errors.password?.message}
            {...register('password')}
          />
          <Button type="submit">Create account</Button>
          {notice ? (
            <p role="status" className="text-small text-caution">
              {notice}
            </p>
          ) : null}
        </form>
      </Card>
      <p className="mt-4 text-small text-ink-muted">
        Already have an account? <Link to={paths.signIn}>Sign in</Link>
      </p>
    </>
  );
}
