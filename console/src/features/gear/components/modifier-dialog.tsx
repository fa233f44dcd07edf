import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Dialog } from '@/components/ui/dialog';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useSaveModifier, type Modifier } from '../api/gear';
import { MODIFIER_KINDS, definedNumber, modifierSchema, type ModifierValues } from '../schemas';

interface ModifierDialogProps {
  modifier: Modifier | 'new' | null;
  onClose: () => void;
}

export function ModifierDialog({ modifier, onClose }: ModifierDialogProps) {
  return (
    <Dialog
      open={modifier !== null}
      onClose={onClose}
      title={modifier === 'new' ? 'Add a modifier' : `Edit ${modifier?.name ?? ''}`}
      description="Light loss is measured against the bare head at the same distance, in stops."
    >
      {modifier !== null ? (
        <ModifierForm
          key={modifier === 'new' ? 'new' : modifier.id}
          modifier={modifier}
          onDone={onClose}
        />
      ) : null}
    </Dialog>
  );
}

function ModifierForm({ modifier, onDone }: { modifier: Modifier | 'new'; onDone: () => void }) {
  const save = useSaveModifier();
  const [formError, setFormError] = useState<string | null>(null);
  const existing = modifier === 'new' ? null : modifier;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<ModifierValues>({
    resolver: zodResolver(modifierSchema),
    defaultValues: {
      name: existing?.name ?? '',
      kind: existing?.kind ?? 'softbox',
      lossStops: existing?.lossStops ?? 1,
      size: existing?.size ?? undefined,
      sizeUnit: existing?.sizeUnit ?? 'm',
      beamAngleDeg: existing?.beamAngleDeg ?? undefined,
      notes: existing?.notes ?? '',
    },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const size = definedNumber(values.size);
    try {
      await save.mutateAsync({
        id: existing?.id,
        body: {
          name: values.name,
          kind: values.kind,
          lossStops: values.lossStops,
          size,
          sizeUnit: values.sizeUnit,
          beamAngleDeg: definedNumber(values.beamAngleDeg),
          notes: values.notes || null,
        },
      });
      onDone();
    } catch (error) {
      const fields = [
        'name',
        'kind',
        'lossStops',
        'size',
        'sizeUnit',
        'beamAngleDeg',
        'notes',
      ] as const;
      setFormError(applyServerErrors(error, fields, setError).formMessage);
    }
  });
  const num = { valueAsNumber: true } as const;
  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4 sm:grid-cols-2">
      <TextField label="Name" error={errors.name?.message} {...register('name')} />
      <SelectField
        label="Kind"
        options={MODIFIER_KINDS.map((kind) => ({ value: kind, label: kind }))}
        error={errors.kind?.message}
        {...register('kind')}
      />
      <TextField
        label="Light loss (stops)"
        type="number"
        step="any"
        error={errors.lossStops?.message}
        {...register('lossStops', num)}
      />
      <TextField
        label="Beam angle (°, optional)"
        type="number"
        step="any"
        error={errors.beamAngleDeg?.message}
        {...register('beamAngleDeg', num)}
      />
      <TextField
        label="Size (optional)"
        type="number"
        step="any"
        error={errors.size?.message}
        {...register('size', num)}
      />
      <SelectField
        label="Size unit"
        options={[
          { value: 'm', label: 'metres' },
          { value: 'ft', label: 'feet' },
        ]}
        error={errors.sizeUnit?.message}
        {...register('sizeUnit')}
      />
      <TextField
        label="Notes (optional)"
        className="sm:col-span-2"
        error={errors.notes?.message}
        {...register('notes')}
      />
      <FormActions
        error={formError}
        submitLabel="Save modifier"
        submitting={isSubmitting}
        onCancel={onDone}
      />
    </form>
  );
}
