import { Button } from './button';
import { Notice } from './notice';

/** The end of a two-column dialog form: the form-wide error, then Cancel and the submit button. */
export function FormActions({
  error,
  submitLabel,
  submitting,
  onCancel,
}: {
  error?: string | null;
  submitLabel: string;
  submitting: boolean;
  onCancel: () => void;
}) {
  return (
    <>
      {error ? (
        <Notice tone="fault" className="sm:col-span-2">
          {error}
        </Notice>
      ) : null}
      <div className="flex justify-end gap-2 sm:col-span-2">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={submitting}>
          {submitLabel}
        </Button>
      </div>
    </>
  );
}
