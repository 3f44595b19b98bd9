import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from '../../../lib/api-client';

/** Puts a 422 answer's field messages beside the fields; answers true when at least one was placed. */
export function applyServerErrors<T extends FieldValues>(error: unknown, fields: readonly string[], setError: UseFormSetError<T>): boolean {
  if (!(error instanceof ApiError) || error.status !== 422 || !Array.isArray(error.details)) return false;
  let placed = false;
  for (const d of error.details as { path?: string; message?: string }[]) {
    const field = d.path?.split('.')[0];
    if (field && fields.includes(field) && d.message) {
      setError(field as Path<T>, { type: 'server', message: d.message });
      placed = true;
    }
  }
  return placed;
}
