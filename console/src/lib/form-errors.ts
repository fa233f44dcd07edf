import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiProblem } from './api';

/** One message for a failed call: the problem's detail, title, or a plain fallback. */
export function problemMessage(
  error: unknown,
  fallback = 'Something went wrong. Try again.',
): string {
  if (error instanceof ApiProblem) {
    if (error.unreachable) return 'The server could not be reached. Check your connection.';
    if (error.status === 429) {
      const wait = error.problem.retryAfterSeconds ?? error.problem['retryAfter'];
      return typeof wait === 'number'
        ? `Too many attempts. Try again in ${Math.ceil(wait)} s.`
        : (error.problem.detail ?? 'Too many attempts. Wait a little and try again.');
    }
    return error.problem.detail ?? error.problem.title ?? error.message;
  }
  if (error instanceof Error && error.message) return error.message;
  return fallback;
}

export interface FieldErrorsResult {
  /** Server fields placed on a form field. */
  placed: string[];
  /** What could not be placed on a field: show it above the submit button. */
  formMessage: string | null;
}

/**
 * Puts a problem+json `errors: [{field, reason}]` list onto react-hook-form fields.
 * `fieldMap` renames server fields (e.g. `organizationName` → `studio`); fields the form does not
 * have end up in `formMessage` so nothing the server said is lost.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
  fieldMap: Record<string, Path<T>> = {},
): FieldErrorsResult {
  const placed: string[] = [];
  const leftovers: string[] = [];
  const entries = error instanceof ApiProblem ? (error.problem.errors ?? []) : [];
  for (const entry of entries) {
    const serverField = entry.field ?? entry.path ?? '';
    const reason = entry.reason ?? entry.message ?? 'is not valid';
    // The API writes array items as `pieces[1].lossStops`; react-hook-form paths are `pieces.1.lossStops`.
    const formPath = serverField.replace(/\[(\d+)\]/g, '.$1');
    const target = fieldMap[serverField] ?? fieldMap[formPath] ?? (formPath as Path<T>);
    if (fields.includes(target)) {
      if (!placed.includes(target)) {
        setError(target, { type: 'server', message: sentence(reason) });
        placed.push(target);
      }
    } else {
      leftovers.push(serverField ? `${serverField} ${reason}` : reason);
    }
  }
  let formMessage: string | null = null;
  if (leftovers.length) formMessage = leftovers.map(sentence).join(' ');
  else if (placed.length === 0) formMessage = problemMessage(error);
  return { placed, formMessage };
}

function sentence(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return trimmed;
  return trimmed[0]!.toUpperCase() + trimmed.slice(1);
}
