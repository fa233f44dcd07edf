import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { applyServerErrors } from '@/lib/form-errors';
import { Button } from './button';
import { Notice } from './notice';
import { TextField } from './text-field';

type NameSchema = z.ZodType<{ name: string }, { name: string }>;

interface NameFormProps {
  /** The name as saved now; the form starts from it. */
  name: string;
  schema: NameSchema;
  label: string;
  hint?: string;
  autoComplete?: string;
  submitLabel: string;
  savedMessage: string;
  /** Saves the (schema-cleaned) name and resolves to the name the server kept. */
  onSave: (name: string) => Promise<string>;
}

/**
 * One name, edited in place: Save is live once it changes, the server's refusal lands on the field
 * (or above the button), and a quiet "saved" follows a save until the next edit.
 */
export function NameForm({
  name,
  schema,
  label,
  hint,
  autoComplete,
  submitLabel,
  savedMessage,
  onSave,
}: NameFormProps) {
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<{ name: string }>({ resolver: zodResolver(schema), defaultValues: { name } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      reset({ name: await onSave(values.name) });
      setSaved(true);
    } catch (error) {
      setFormError(applyServerErrors(error, ['name'], setError).formMessage);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField
        label={label}
        autoComplete={autoComplete}
        hint={hint}
        error={errors.name?.message}
        {...register('name', { onChange: () => setSaved(false) })}
      />
      {formError ? <Notice tone="fault">{formError}</Notice> : null}
      {saved && !isDirty ? <Notice tone="ok">{savedMessage}</Notice> : null}
      <div>
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          {submitLabel}
        </Button>
      </div>
    </form>
  );
}
