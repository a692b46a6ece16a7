// A failed request as a form shows it: messages for the fields it places beside their inputs, and
// for everything else one line each that names the field by its label (never `crewIds: …`).
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { fieldLabel } from '../../shared/schemas/field-labels';
import { ApiError } from './api-client';

/** How a form places field messages: which of its fields have an input, and where a contract path is typed. */
export type FieldPlacement = {
  /** Form fields shown beside an input; a path under one (`limits.ttd.highWatch` under `limits`) counts as placed. */
  placed: readonly string[];
  /** The form field that holds a contract path (e.g. `pressure.value` → `pressure`); the path itself when it returns nothing. */
  fieldFor?: ((path: string) => string | undefined) | undefined;
};

const formField = (path: string, placement: FieldPlacement) => placement.fieldFor?.(path) ?? path;
export const isPlaced = (field: string, placed: readonly string[]) => placed.some((p) => field === p || field.startsWith(`${p}.`));

/** Puts the server's per-field messages on the fields the form places; returns the message for the form as a whole. */
export function applyServerErrors<T extends FieldValues>(error: unknown, setError: UseFormSetError<T>, placement?: FieldPlacement): string {
  if (error instanceof ApiError) {
    for (const [path, message] of Object.entries(error.fields)) {
      if (path === '_') continue;
      const field = placement ? formField(path, placement) : path;
      if (!placement || isPlaced(field, placement.placed)) setError(field as Path<T>, { type: 'server', message });
    }
    return error.fields._ ?? error.message;
  }
  return 'Something went wrong; nothing was saved';
}

const fieldErrorsOf = (error: unknown): Record<string, string> => (error instanceof ApiError ? error.fields : {});

/** The field's message, starting with its label unless it already does. */
export function labelled(field: string, message: string): string {
  const label = fieldLabel(field);
  return !label || message.toLowerCase().startsWith(label.toLowerCase()) ? message : `${label}: ${message}`;
}

/** Messages for the fields not shown beside an input, each starting with its field's label. */
export function otherFieldMessages(error: unknown, placed: readonly string[] = [], fieldFor?: FieldPlacement['fieldFor']): string[] {
  return Object.entries(fieldErrorsOf(error))
    .filter(([path]) => path !== '_' && !isPlaced(formField(path, { placed, fieldFor }), placed))
    .map(([path, message]) => labelled(path, message));
}
