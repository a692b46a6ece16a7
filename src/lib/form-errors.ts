import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { ApiError } from './api-client';

/** Puts the server's per-field messages on the form; returns the message for the form as a whole. */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>): string {
  if (error instanceof ApiError) {
    for (const [field, message] of Object.entries(error.fields)) {
      if (field !== '_') setError(field as Path<T>, { type: 'server', message });
    }
    return error.fields._ ?? error.message;
  }
  return 'Something went wrong; nothing was saved';
}
