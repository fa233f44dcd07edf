import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Dialog } from '@/components/ui/dialog';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import { useSaveGelPiece, type GelPiece } from '../api/gear';
import { gelPieceSchema, type GelPieceValues } from '../schemas';

export interface GelPieceTarget {
  kitId: string;
  piece: GelPiece | 'new';
}

export function GelPieceDialog({
  target,
  onClose,
}: {
  target: GelPieceTarget | null;
  onClose: () => void;
}) {
  const piece = target?.piece;
  return (
    <Dialog
      open={target !== null}
      onClose={onClose}
      title={piece === 'new' ? 'Add a gel' : `Edit ${piece?.name ?? ''}`}
      description="Mired shift: positive warms (CTO-like), negative cools (CTB-like). Green shift in CC units: plus-green positive, minus-green (magenta) negative."
    >
      {target ? (
        <GelPieceForm
          key={target.piece === 'new' ? 'new' : target.piece.id}
          target={target}
          onDone={onClose}
        />
      ) : null}
    </Dialog>
  );
}

function GelPieceForm({ target, onDone }: { target: GelPieceTarget; onDone: () => void }) {
  const save = useSaveGelPiece();
  const [formError, setFormError] = useState<string | null>(null);
  const existing = target.piece === 'new' ? null : target.piece;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<GelPieceValues>({
    resolver: zodResolver(gelPieceSchema),
    defaultValues: {
      name: existing?.name ?? '',
      miredShift: existing?.miredShift ?? 0,
      greenShift: existing?.greenShift ?? 0,
      lossStops: existing?.lossStops ?? 0,
    },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await save.mutateAsync({ kitId: target.kitId, pieceId: existing?.id, body: values });
      onDone();
    } catch (error) {
      const fields = ['name', 'miredShift', 'greenShift', 'lossStops'] as const;
      setFormError(applyServerErrors(error, fields, setError).formMessage);
    }
  });
  const num = { valueAsNumber: true } as const;
  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4 sm:grid-cols-2">
      <TextField
        label="Name"
        className="sm:col-span-2"
        error={errors.name?.message}
        {...register('name')}
      />
      <TextField
        label="Mired shift"
        type="number"
        step="any"
        error={errors.miredShift?.message}
        {...register('miredShift', num)}
      />
      <TextField
        label="Green shift (CC units)"
        type="number"
        step="any"
        error={errors.greenShift?.message}
        {...register('greenShift', num)}
      />
      <TextField
        label="Light loss (stops)"
        type="number"
        step="any"
        error={errors.lossStops?.message}
        {...register('lossStops', num)}
      />
      <FormActions
        error={formError}
        submitLabel="Save gel"
        submitting={isSubmitting}
        onCancel={onDone}
      />
    </form>
  );
}
