import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Notice } from '@/components/ui/notice';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { applyServerErrors } from '@/lib/form-errors';
import {
  useSaveSetup,
  type NewSavedSetup,
  type OpenedSetup,
  type SavedSetupInputs,
} from '../../api/saved-setups';

const schema = z.object({
  name: z.string().trim().min(1, 'Name the setup').max(120, 'Use at most 120 characters'),
  venue: z.string().trim().max(200, 'Use at most 200 characters'),
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick the shoot date'),
  timeZone: z.string().trim().min(1, 'Enter an IANA time zone, e.g. Europe/Zurich').max(64),
  notes: z.string().max(5000, 'Use at most 5000 characters'),
});
type SaveValues = z.infer<typeof schema>;

const fields = ['name', 'venue', 'date', 'timeZone', 'notes'] as const;
/** Server field paths mapped onto this form; other `inputs.*` complaints show above the buttons. */
const fieldMap = { 'inputs.date': 'date', 'inputs.timeZone': 'timeZone' } as const;

/** Why a save was stopped before sending; `retry` offers "Try again" (nothing needs changing). */
export interface SaveStop {
  message: string;
  retry?: boolean;
}

interface SaveSetupDialogProps {
  open: boolean;
  onClose: () => void;
  /** The Dusk setup tab's current input (what the preview shows), gear it came from named by id. */
  input: SavedSetupInputs;
  /** Prefill, e.g. venue and notes of a reopened setup (names must be new: the server refuses repeats). */
  initial?: Partial<Pick<SaveValues, 'name' | 'venue' | 'notes'>>;
  onSaved: (setup: OpenedSetup) => void;
  /** Run before sending; a stop instead of null stops the save and is shown. */
  checkBeforeSave?: () => Promise<SaveStop | null>;
}

export function toSaveBody(values: SaveValues, input: SavedSetupInputs): NewSavedSetup {
  return {
    name: values.name,
    ...(values.venue ? { venue: values.venue } : {}),
    ...(values.notes ? { notes: values.notes } : {}),
    inputs: { ...input, date: values.date, timeZone: values.timeZone },
  };
}

export function SaveSetupDialog(props: SaveSetupDialogProps) {
  return (
    <Dialog
      open={props.open}
      onClose={props.onClose}
      title="Save setup"
      description="Saves the Dusk setup inputs as they are now; the server plans the setup again from them."
    >
      {/* Mounted afresh on each opening, so it starts from the scene's date and zone. */}
      <SaveSetupForm {...props} />
    </Dialog>
  );
}

function SaveSetupForm({
  onClose,
  input,
  initial,
  onSaved,
  checkBeforeSave,
}: SaveSetupDialogProps) {
  const save = useSaveSetup();
  const [formError, setFormError] = useState<string | null>(null);
  // A check that could not run: shown with "Try again"; the boxes keep what was typed.
  const [retryable, setRetryable] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SaveValues>({
    resolver: zodResolver(schema),
    defaultValues: {
      name: initial?.name ?? '',
      venue: initial?.venue ?? '',
      notes: initial?.notes ?? '',
      date: input.date,
      timeZone: input.timeZone,
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setRetryable(null);
    const stop = checkBeforeSave ? await checkBeforeSave() : null;
    if (stop) {
      if (stop.retry) setRetryable(stop.message);
      else setFormError(stop.message);
      return;
    }
    try {
      const saved = await save.mutateAsync(toSaveBody(values, input));
      onSaved(saved);
    } catch (error) {
      setFormError(applyServerErrors(error, fields, setError, fieldMap).formMessage);
    }
  });

  return (
    <form noValidate onSubmit={onSubmit} className="grid gap-4 sm:grid-cols-2">
      <TextField label="Name" error={errors.name?.message} {...register('name')} />
      <TextField label="Venue (optional)" error={errors.venue?.message} {...register('venue')} />
      <TextField label="Date" type="date" error={errors.date?.message} {...register('date')} />
      <TextField
        label="Time zone"
        hint="IANA name, e.g. Europe/Zurich"
        error={errors.timeZone?.message}
        {...register('timeZone')}
      />
      <TextField
        label="Notes (optional)"
        className="sm:col-span-2"
        error={errors.notes?.message}
        {...register('notes')}
      />
      {retryable ? (
        <Notice tone="fault" className="flex flex-wrap items-center gap-x-3 gap-y-2 sm:col-span-2">
          <span className="min-w-0 flex-1 basis-48">{retryable}</span>
          <Button
            variant="secondary"
            size="sm"
            disabled={isSubmitting}
            onClick={() => void onSubmit()}
          >
            Try again
          </Button>
        </Notice>
      ) : null}
      <FormActions
        error={formError}
        submitLabel="Save setup"
        submitting={isSubmitting}
        onCancel={onClose}
      />
    </form>
  );
}
