import type { Preview } from '../hooks/use-preview';
import { calculationById, type CalculationId } from '../calculations';
import { ApiConfirmation } from './api-confirmation';
import { Cautions } from './cautions';
import type { Caution } from '@lumenwright/shared';
import { CopySnippets } from './copy-snippets';

interface CalculationResultProps<I, R> {
  calculation: CalculationId;
  preview: Preview<I, R>;
  /** Field labels, so a shared/ error can name the field the way the form does. */
  fieldLabels?: Record<string, string>;
  cautions?: readonly Caution[];
  children: (result: R, input: I) => React.ReactNode;
}

/** Result frame: the drawing and readouts, or why there are none; API check; copy; cautions. */
export function CalculationResult<I, R>({
  calculation,
  preview,
  fieldLabels = {},
  cautions = [],
  children,
}: CalculationResultProps<I, R>) {
  const path = calculationById(calculation)?.path ?? '';
  const headingId = `${calculation}-result-heading`;
  return (
    <section aria-labelledby={headingId} className="flex min-w-0 flex-col gap-4">
      <h2 id={headingId} className="sr-only">
        Result
      </h2>
      {preview.state === 'ok' ? (
        children(preview.result, preview.input)
      ) : preview.state === 'invalid' ? (
        <p role="alert" className="rounded-card border border-fault/60 bg-panel p-4 text-fault">
          {fieldLabels[preview.field] ?? preview.field}: {preview.reason}
        </p>
      ) : preview.state === 'failed' ? (
        <p role="alert" className="rounded-card border border-fault/60 bg-panel p-4 text-fault">
          {preview.message}
        </p>
      ) : (
        <p className="rounded-card border border-edge bg-panel p-4 text-ink-muted">
          Fill in the form to see the result.
        </p>
      )}
      {preview.state !== 'empty' ? (
        <div className="flex flex-col gap-3 rounded-card border border-edge bg-panel p-4 print:hidden">
          <ApiConfirmation
            calculation={calculation}
            input={preview.state === 'ok' ? preview.input : undefined}
            preview={preview.state === 'ok' ? preview.result : undefined}
          />
          <CopySnippets path={path} body={preview.input} />
        </div>
      ) : null}
      <Cautions cautions={cautions} />
    </section>
  );
}
