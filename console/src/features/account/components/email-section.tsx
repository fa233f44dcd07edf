import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useEmailState, useRequestEmailChange } from '../api/account';
import { emailChangeSchema, type EmailChangeValues } from '../schemas';

/**
 * A new sign-in address: the server mails a link to it and changes nothing until the link is
 * opened. A change still waiting for its link comes from GET /v1/me/email, so it is shown on any
 * visit until it is confirmed or expires.
 */
export function EmailSection({ currentEmail }: { currentEmail: string }) {
  const request = useRequestEmailChange();
  const state = useEmailState();
  const [justAsked, setJustAsked] = useState<string | null>(null);
  const [anotherAddress, setAnotherAddress] = useState(false);
  const pending = anotherAddress ? null : (justAsked ?? state.data?.pendingEmail ?? null);
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<EmailChangeValues>({
    resolver: zodResolver(emailChangeSchema),
    defaultValues: { newEmail: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await request.mutateAsync(values);
      setJustAsked(values.newEmail);
      setAnotherAddress(false);
      reset({ newEmail: '', password: '' });
    } catch (error) {
      setFormError(applyServerErrors(error, ['newEmail', 'password'], setError).formMessage);
    }
  });

  return (
    <Card aria-labelledby="email-heading">
      <h2 id="email-heading" className="text-title font-semibold">
        Email
      </h2>
      <p className="mt-1 break-words text-small text-ink-muted">
        You sign in with <span className="font-medium text-ink">{currentEmail}</span>.
      </p>
      {pending ? (
        <div className="mt-4 flex flex-col gap-3">
          <Notice tone="ok">
            Check your inbox at <span className="font-medium break-all">{pending}</span>: open the
            link we sent there to finish the change. Until then you keep signing in with{' '}
            <span className="break-all">{currentEmail}</span>.
          </Notice>
          <div>
            <Button
              variant="secondary"
              onClick={() => {
                setJustAsked(null);
                setAnotherAddress(true);
              }}
            >
              Use another address
            </Button>
          </div>
        </div>
      ) : (
        <form noValidate onSubmit={onSubmit} className="mt-4 flex flex-col gap-4">
          <TextField
            label="New email"
            type="email"
            autoComplete="email"
            error={errors.newEmail?.message}
            {...register('newEmail')}
          />
          <TextField
            label="Password"
            type="password"
            autoComplete="current-password"
            hint="Your current password, to confirm it is you."
            error={errors.password?.message}
            {...register('password')}
          />
          {formError ? <Notice tone="fault">{formError}</Notice> : null}
          <div>
            <Button type="submit" disabled={isSubmitting}>
              Send confirmation link
            </Button>
          </div>
        </form>
      )}
    </Card>
  );
}
