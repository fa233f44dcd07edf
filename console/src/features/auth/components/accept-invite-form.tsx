import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { applyServerErrors, problemMessage } from '@/lib/form-errors';
import { useAcceptInvite, useInvitePreview, type InvitePreview } from '../api/invites';
import { PASSWORD_MIN, acceptInviteSchema, type AcceptInviteValues } from '../schemas';

export function AcceptInvite() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const preview = useInvitePreview(token);

  if (!token) return <Notice tone="fault">This invitation link has no token.</Notice>;
  if (preview.isPending) return <PageLoading />;
  if (preview.isError) {
    return (
      <Notice tone="fault">
        {problemMessage(preview.error)} Ask whoever invited you to send a new invitation.
      </Notice>
    );
  }
  return <AcceptInviteForm token={token} invite={preview.data} />;
}

function AcceptInviteForm({ token, invite }: { token: string; invite: InvitePreview }) {
  const navigate = useNavigate();
  const accept = useAcceptInvite();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<AcceptInviteValues>({
    resolver: zodResolver(acceptInviteSchema(invite.existingAccount)),
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await accept.mutateAsync(
        invite.existingAccount
          ? { token }
          : { token, name: values.name, password: values.password },
      );
      await navigate(paths.overview, { replace: true });
    } catch (error) {
      const result = applyServerErrors(error, ['name', 'password'], setError);
      setFormError(result.formMessage);
    }
  });

  return (
    <Card>
      <p className="text-body text-ink">
        <strong>{invite.organizationName}</strong> invites <strong>{invite.email}</strong> to join
        as <strong>{invite.role}</strong>. The invitation expires{' '}
        {new Date(invite.expiresAt).toLocaleString()}.
      </p>
      <form noValidate onSubmit={onSubmit} className="mt-4 flex flex-col gap-4">
        {invite.existingAccount ? (
          <p className="text-small text-ink-muted">
            You already have an account with this address. If you are not signed in as{' '}
            {invite.email},{' '}
            <Link
              to={`${paths.signIn}?next=${encodeURIComponent(`${paths.acceptInvite}?token=${token}`)}`}
            >
              sign in first
            </Link>
            .
          </p>
        ) : (
          <>
            <TextField
              label="Your name"
              autoComplete="name"
              error={errors.name?.message}
              {...register('name')}
            />
            <TextField
              label="Choose a password"
              type="password"
              autoComplete="new-password"
              hint={`At least ${PASSWORD_MIN} characters.`}
              error={errors.password?.message}
              {...register('password')}
            />
          </>
        )}
        {formError ? <Notice tone="fault">{formError}</Notice> : null}
        <Button type="submit" disabled={isSubmitting}>
          Join {invite.organizationName}
        </Button>
      </form>
    </Card>
  );
}
