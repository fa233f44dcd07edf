import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Dialog } from '@/components/ui/dialog';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { todayIso } from '@/lib/format';
import { useCreateSetup } from '../api/setups';
import {
  saveSetupSchema,
  setupFieldMap,
  toCreateSetupBody,
  type SaveSetupValues,
} from '../schemas';

const fields = [
  'name',
  'venue',
  'date',
  'timeZone',
  'latitude',
  'longitude',
  'keyGuideNumber',
  'keyDistance',
  'notes',
] as const;

function browserTimeZone(): string {
  try {
    return Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';
  } catch {
    return 'UTC';
  }
}

export function SaveSetupDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const create = useCreateSetup();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<SaveSetupValues>({
    resolver: zodResolver(saveSetupSchema),
    defaultValues: {
      name: '',
      venue: '',
      notes: '',
      date: todayIso(),
      timeZone: browserTimeZone(),
      keyGuideNumber: 40,
      keyDistance: 2,
    },
  });
  const close = () => {
    setFormError(null);
    reset();
    onClose();
  };
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await create.mutateAsync(toCreateSetupBody(values));
      close();
    } catch (error) {
      setFormError(applyServerErrors(error, fields, setError, setupFieldMap).formMessage);
    }
  });
  const num = { valueAsNumber: true } as const;

  return (
    <Dialog
      open={open}
      onClose={close}
      title="Save a setup"
      description="Where and when you shoot, and the key light; the server plans the exposure, flash and gels. Fine-tune it later in the playground."
    >
      <form noValidate onSubmit={onSubmit} className="grid gap-4 sm:grid-cols-2">
        <TextField label="Name" error={errors.name?.message} {...register('name')} />
        <TextField label="Venue (optional)" error={errors.venue?.message} {...register('venue')} />
        <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
        <TextField
          label="Time zone"
          hint="IANA name, e.g. America/Denver"
          error={errors.timeZone?.message}
          {...register('timeZone')}
        />
        <TextField
          label="Latitude (°)"
          type="number"
          step="any"
          error={errors.latitude?.message}
          {...register('latitude', num)}
        />
        <TextField
          label="Longitude (°, east positive)"
          type="number"
          step="any"
          error={errors.longitude?.message}
          {...register('longitude', num)}
        />
        <TextField
          label="Key guide number (m, ISO 100)"
          type="number"
          step="any"
          error={errors.keyGuideNumber?.message}
          {...register('keyGuideNumber', num)}
        />
        <TextField
          label="Key distance (m)"
          type="number"
          step="any"
          error={errors.keyDistance?.message}
          {...register('keyDistance', num)}
        />
        <TextField
          label="Notes (optional)"
          className="sm:col-span-2"
          error={errors.notes?.message}
          {...register('notes')}
        />
        <FormActions
          error={formError}
          submitLabel="Save setup"
          submitting={isSubmitting}
          onCancel={close}
        />
      </form>
    </Dialog>
  );
}
