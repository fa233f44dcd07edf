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

const signInSchema = z.object({
  email: z.email('Enter the email you signed up with'),
  password: z.string().min(1, 'Enter your password'),
});
type SignInValues = z.infer<typeof signInSchema>;

export default function SignInRoute() {
  const [notice, setNotice] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    formState: { errors },
  } = useForm<SignInValues>({ resolver: zodResolver(signInSchema) });

  // The session endpoints land with the accounts work; until then say so plainly.
  const onSubmit = handleSubmit(() => setNotice('Signing in is not connected to the server yet.'));

  return (
    <>
      <PageHeader title="Sign in" lead="Open your studio’s console." />
      <Card>
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
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
          <Button type="submit">Sign in</Button>
          {notice ? (
            <p role="status" className="text-small text-caution">
              {notice}
            </p>
          ) : null}
        </form>
      </Card>
      <p className="mt-4 text-small text-ink-muted">
        New here? <Link to={paths.signUp}>Create a studio account</Link>
      </p>
    </>
  );
}
