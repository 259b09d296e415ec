import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiRequestError } from './api-client';

/**
 * Puts the API's per-field messages (the `fieldErrors` of a 400, from the same shared schema as the
 * form) beside the form's own fields. Returns whether any was placed.
 */
export function showApiFieldErrors<T extends FieldValues>(error: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): boolean {
  if (!(error instanceof ApiRequestError)) return false;
  let placed = false;
  for (const field of fields) {
    const message = error.fieldErrors[field]?.[0];
    if (message) {
      setError(field, { message });
      placed = true;
    }
  }
  return placed;
}
