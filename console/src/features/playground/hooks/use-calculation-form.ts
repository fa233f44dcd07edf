import { zodResolver } from '@hookform/resolvers/zod';
import { fromMetres, toMetres } from '@lumenwright/shared';
import { useEffect, useRef } from 'react';
import {
  get,
  useForm,
  useWatch,
  type DefaultValues,
  type FieldValues,
  type Path,
  type PathValue,
  type Resolver,
} from 'react-hook-form';
import { z } from 'zod';
import { useLengthUnit, type DisplayUnit } from './use-length-unit';
import { usePreview } from './use-preview';

interface CalculationFormOptions<F extends FieldValues, I, R> {
  schema: z.ZodType<F, F>;
  defaults: DefaultValues<F>;
  /** Form values (checked by `schema`) to the shared function's input. */
  toInput: (values: F, unit: DisplayUnit) => I | undefined;
  compute: (input: I) => R;
  /** Fields holding lengths in the display unit; converted when the unit is switched. */
  lengthFields?: readonly Path<F>[];
}

/**
 * A playground form: react-hook-form + zod for the basics, the shared function for everything
 * else (ranges, combinations), recomputed on every change for a live preview.
 */
export function useCalculationForm<F extends FieldValues, I, R>({
  schema,
  defaults,
  toInput,
  compute,
  lengthFields = [],
}: CalculationFormOptions<F, I, R>) {
  const [unit] = useLengthUnit();
  const form = useForm<F, unknown, F>({
    resolver: zodResolver(schema as never) as unknown as Resolver<F, unknown, F>,
    mode: 'onChange',
    defaultValues: defaults,
  });
  const values = useWatch({ control: form.control });
  const parsed = schema.safeParse(values);
  const input = parsed.success ? toInput(parsed.data, unit) : undefined;
  const preview = usePreview(compute, input);

  // Switching metres/feet converts what is typed, so the scene stays the same size.
  const previousUnit = useRef(unit);
  useEffect(() => {
    if (previousUnit.current === unit) return;
    const from = previousUnit.current;
    previousUnit.current = unit;
    for (const field of lengthFields) {
      const value = form.getValues(field) as unknown;
      if (typeof value === 'number' && Number.isFinite(value)) {
        const converted = Number(fromMetres(toMetres(value, from), unit).toFixed(2));
        form.setValue(field, converted as PathValue<F, Path<F>>, { shouldValidate: true });
      }
    }
  }, [unit, form, lengthFields]);

  const sharedError = preview.state === 'invalid' ? preview : null;
  /** The form's own error for a field, else the shared function's complaint about it. */
  const errorFor = (field: string, sharedField: string = field): string | undefined => {
    const own = get(form.formState.errors, field) as { message?: string } | undefined;
    if (own?.message) return own.message;
    if (sharedError?.field !== sharedField) return undefined;
    // A 1/x box reports the library's limits in seconds: say them in x, as typed.
    return field.endsWith('Denominator') ? inDenominators(sharedError.reason) : sharedError.reason;
  };

  /**
   * Props for a numeric TextField bound to `field`. `whenEmpty` is what the calculation uses for an
   * empty box (e.g. "default 5.6"), shown as the placeholder so an empty box never hides a value.
   */
  const numberField = (field: Path<F>, sharedField?: string, whenEmpty?: string) => ({
    type: 'number',
    step: 'any',
    inputMode: 'decimal' as const,
    ...(whenEmpty ? { placeholder: whenEmpty } : {}),
    error: errorFor(field, sharedField),
    ...form.register(field, { valueAsNumber: true }),
  });

  return { form, unit, input, preview, errorFor, numberField };
}

/** valueAsNumber gives NaN for an empty box: treat that as "not given". */
export function given(value: number | undefined): number | undefined {
  return value === undefined || Number.isNaN(value) ? undefined : value;
}

/** An optional number box: a number, or NaN (empty) for "not given". */
export const optionalNumberField = z.union([z.number(), z.nan()]).optional();

/** An optional 1/x seconds box: x above 0 when given (1/0 has no meaning). */
export const optionalDenominatorField = optionalNumberField.refine(
  (v) => v === undefined || Number.isNaN(v) || v > 0,
  { error: 'Enter x of 1/x s above 0, e.g. 200, or leave it empty' },
);

/** 1/x seconds from a denominator box, or undefined when it is empty. */
export function secondsFrom(denominator: number | undefined): number | undefined {
  const x = given(denominator);
  return x === undefined ? undefined : 1 / x;
}

/**
 * A limit on seconds restated for the 1/x box: "must be between 0.0000625 and 1" (seconds) becomes
 * "must be between 1 and 16000"; "at most 30" becomes "at least 0.0333".
 */
export function inDenominators(reason: string): string {
  const x = (seconds: string) => String(Number((1 / Number(seconds)).toPrecision(4)));
  const NUM = '(\\d+(?:\\.\\d+)?(?:e-?\\d+)?)';
  const between = new RegExp(`between ${NUM} and ${NUM}`).exec(reason);
  if (between) return reason.replace(between[0], `between ${x(between[2]!)} and ${x(between[1]!)}`);
  return reason.replace(
    new RegExp(`(at least|at most|more than) ${NUM}`, 'g'),
    (_, bound: string, n: string) =>
      `${bound === 'at most' ? 'at least' : bound === 'at least' ? 'at most' : 'less than'} ${x(n)}`,
  );
}
