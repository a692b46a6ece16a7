// A failed request as a form shows it: messages for the fields it places beside their inputs, and
// for everything else one line each that names the field by its label (never `crewIds: …`).
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { fieldLabel } from '../../shared/schemas/field-labels';
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

export const fieldErrorsOf = (error: unknown): Record<string, string> => (error instanceof ApiError ? error.fields : {});

/** Messages for the fields not shown beside an input, each starting with its field's label. */
export function otherFieldMessages(error: unknown, placed: readonly string[] = []): string[] {
  return Object.entries(fieldErrorsOf(error))
    .filter(([field]) => !placed.includes(field))
    .map(([field, message]) => {
      const label = fieldLabel(field);
      return !label || message.toLowerCase().startsWith(label.toLowerCase()) ? message : `${label}: ${message}`;
    });
}
