import type { FieldPath, FieldValues, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/**
 * A 400 from the API. It validates with the same shared zod schema as the form, so its
 * messages belong next to the fields rather than in a box above them.
 */
export const isFieldRefusal = (error: unknown): error is ApiRequestError =>
  error instanceof ApiRequestError && error.status === 400;

/**
 * Puts the API's per-field messages onto the form's fields. The API names fields by their
 * path in the body (`axes.0.min`), which is react-hook-form's naming too; `_` is the body as a whole.
 * `fieldFor` maps a body path to the form field that shows it, where the two differ.
 */
export function applyFieldErrors<T extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<T>,
  fieldFor: (bodyPath: string) => string = (bodyPath) => bodyPath,
): void {
  if (!isFieldRefusal(error)) return;
  for (const [field, messages] of Object.entries(error.fieldErrors)) {
    if (messages[0] && field !== '_') setError(fieldFor(field) as FieldPath<T>, { type: 'server', message: messages[0] });
  }
}
