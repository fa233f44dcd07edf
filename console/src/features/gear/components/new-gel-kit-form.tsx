import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateGelKit } from '../api/gear';

const schema = z.object({ name: z.string().trim().min(1, 'Name the kit').max(80) });

export function NewGelKitForm() {
  const create = useCreateGelKit();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<{ name: string }>({ resolver: zodResolver(schema), defaultValues: { name: '' } });
  const onSubmit = handleSubmit(async ({ name }) => {
    setFormError(null);
    try {
      await create.mutateAsync(name);
      reset();
    } catch (error) {
      setFormError(applyServerErrors(error, ['name'], setError).formMessage);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-wrap items-start gap-3">
      <TextField label="New gel kit" error={errors.name?.message} {...register('name')} />
      <Button type="submit" disabled={isSubmitting} className="mt-6">
        Add kit
      </Button>
      {formError ? (
        <Notice tone="fault" className="w-full">
          {formError}
        </Notice>
      ) : null}
    </form>
  );
}
