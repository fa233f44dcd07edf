import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { todayIso } from '@/lib/format';
import { useCreateKey } from '../api/create-key';
import type { ApiKeyCreated } from '../api/keys';
import { createKeySchema, toCreateKeyBody, type CreateKeyValues } from '../schemas';
import { SecretReveal } from './secret-reveal';

const fieldMap = { expiresAt: 'expiresOn' } as const;

export function CreateKeyDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const create = useCreateKey();
  const [created, setCreated] = useState<ApiKeyCreated | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [today] = useState(todayIso);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<CreateKeyValues>({
    resolver: zodResolver(createKeySchema(today)),
    defaultValues: { name: '', environment: 'test', expiresOn: '' },
  });

  const close = () => {
    setCreated(null);
    setFormError(null);
    reset();
    onClose();
  };

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      setCreated(await create.mutateAsync(toCreateKeyBody(values)));
    } catch (error) {
      setFormError(
        applyServerErrors(error, ['name', 'environment', 'expiresOn'], setError, fieldMap)
          .formMessage,
      );
    }
  });

  return (
    <Dialog
      open={open}
      // While the secret is on screen, only the explicit button closes the dialog.
      onClose={created ? () => undefined : close}
      title={created ? `Key “${created.name}” created` : 'Create an API key'}
      description={created ? undefined : 'Test keys reach the same math but are not billed.'}
    >
      {created ? (
        <SecretReveal secret={created.secret} onDone={close} />
      ) : (
        <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
          <TextField label="Name" error={errors.name?.message} {...register('name')} />
          <SelectField
            label="Environment"
            options={[
              { value: 'test', label: 'Test (not billed)' },
              { value: 'live', label: 'Live' },
            ]}
            error={errors.environment?.message}
            {...register('environment')}
          />
          <TextField
            label="Expires on (optional)"
            type="date"
            min={today}
            hint="Leave empty for a key that lasts until revoked."
            error={errors.expiresOn?.message}
            {...register('expiresOn')}
          />
          {formError ? <Notice tone="fault">{formError}</Notice> : null}
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" disabled={isSubmitting}>
              Create key
            </Button>
          </div>
        </form>
      )}
    </Dialog>
  );
}
