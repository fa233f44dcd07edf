import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useSaveLight, type Light } from '../api/gear';
import { lightSchema, type LightValues } from '../schemas';

interface LightDialogProps {
  /** null: closed; 'new': add; a light: edit it. */
  light: Light | 'new' | null;
  onClose: () => void;
}

export function LightDialog({ light, onClose }: LightDialogProps) {
  return (
    <Dialog
      open={light !== null}
      onClose={onClose}
      title={light === 'new' ? 'Add a light' : `Edit ${light?.name ?? ''}`}
      description="Guide number at ISO 100 and full power, as the maker states it."
    >
      {light !== null ? (
        <LightForm key={light === 'new' ? 'new' : light.id} light={light} onDone={onClose} />
      ) : null}
    </Dialog>
  );
}

function LightForm({ light, onDone }: { light: Light | 'new'; onDone: () => void }) {
  const save = useSaveLight();
  const [formError, setFormError] = useState<string | null>(null);
  const existing = light === 'new' ? null : light;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<LightValues>({
    resolver: zodResolver(lightSchema),
    defaultValues: {
      name: existing?.name ?? '',
      guideNumber: existing?.guideNumber ?? 40,
      guideNumberUnit: existing?.guideNumberUnit ?? 'm',
      notes: existing?.notes ?? '',
    },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await save.mutateAsync({
        id: existing?.id,
        body: {
          name: values.name,
          guideNumber: values.guideNumber,
          guideNumberUnit: values.guideNumberUnit,
          notes: values.notes || null,
        },
      });
      onDone();
    } catch (error) {
      const fields = ['name', 'guideNumber', 'guideNumberUnit', 'notes'] as const;
      setFormError(applyServerErrors(error, fields, setError).formMessage);
    }
  });
  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextField label="Name" error={errors.name?.message} {...register('name')} />
      <div className="grid grid-cols-2 gap-4">
        <TextField
          label="Guide number"
          type="number"
          step="any"
          error={errors.guideNumber?.message}
          {...register('guideNumber', { valueAsNumber: true })}
        />
        <SelectField
          label="Guide number unit"
          options={[
            { value: 'm', label: 'metres' },
            { value: 'ft', label: 'feet' },
          ]}
          error={errors.guideNumberUnit?.message}
          {...register('guideNumberUnit')}
        />
      </div>
      <TextField label="Notes (optional)" error={errors.notes?.message} {...register('notes')} />
      {formError ? <Notice tone="fault">{formError}</Notice> : null}
      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          Save light
        </Button>
      </div>
    </form>
  );
}
