import type { ErrorRequestHandler } from 'express';
import { UniqueConstraintError } from 'sequelize';
import { ZodError } from 'zod';
import { fieldLabel } from '../../shared/schemas/field-labels';

export type FieldErrors = Record<string, string>;

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    /** What a form needs beyond the field messages to act on the answer. */
    readonly details?: unknown,
  ) {
    super(message);
  }
}
export class ValidationError extends HttpError {
  constructor(fields: FieldErrors, message = summaryOf(fields)) {
    super(400, 'VALIDATION', message, fields);
  }
}

/** One line for the top of a form: the fields to look at, by the labels a person sees. */
export function summaryOf(fields: FieldErrors): string {
  const labels = [...new Set(Object.keys(fields).map(fieldLabel).filter(Boolean))];
  if (!labels.length) return fields._ ?? 'Some fields need attention';
  return `Some fields need attention: ${labels.join(', ')}`;
}

/** Input that is possible but needs the person to say they meant it; the field messages say what and why. */
export class ConfirmationRequired extends HttpError {
  constructor(code: string, message: string, fields: FieldErrors, details: unknown) {
    super(400, code, message, fields, details);
  }
}
export class Unauthorized extends HttpError {
  constructor(message = 'Sign in to continue') {
    super(401, 'UNAUTHENTICATED', message);
  }
}
export class Forbidden extends HttpError {
  constructor(message = 'Your role does not allow this', code = 'FORBIDDEN') {
    super(403, code, message);
  }
}
export class NotFound extends HttpError {
  constructor(what = 'That record') {
    super(404, 'NOT_FOUND', `${what} was not found`);
  }
}
export class Conflict extends HttpError {
  constructor(message: string) {
    super(409, 'CONFLICT', message);
  }
}

/** Turns zod issues into { "a.b": "message" } — the first message per field. */
export function fieldErrorsFromZod(error: ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

type BodyParserError = Error & { type?: string; status?: number };

export const errorMiddleware: ErrorRequestHandler = (error, req, res, next) => {
  // An error after the answer began (a stream cut off): too late for a JSON reply; Express's own
  // handler closes the connection (and the request's log line carries the error). Answering again
  // threw ERR_HTTP_HEADERS_SENT.
  if (res.headersSent) {
    (res as typeof res & { err?: unknown }).err = error;
    next(error);
    return;
  }
  if (error instanceof ZodError) {
    const fields = fieldErrorsFromZod(error);
    res.status(400).json({ error: { code: 'VALIDATION', message: summaryOf(fields), fields } });
    return;
  }
  if (error instanceof HttpError) {
    res.status(error.status).json({ error: { code: error.code, message: error.message, fields: error.fields, details: error.details } });
    return;
  }
  // The database's unique keys are the last word on "only one of these": a second one, however it
  // got past the service's own checks (two people at once, a repeated click), is a conflict.
  if (error instanceof UniqueConstraintError) {
    res.status(409).json({ error: { code: 'DUPLICATE', message: 'This was saved already (by someone else, or by an earlier click); reload to see it' } });
    return;
  }
  // A path whose %-encoding is broken (the router cannot decode its ids).
  if (error instanceof URIError) {
    res.status(400).json({ error: { code: 'BAD_ADDRESS', message: 'This address is damaged (a broken %-code); go back and follow the link again' } });
    return;
  }
  const parserError = error as BodyParserError;
  if (parserError.type === 'entity.parse.failed') {
    res.status(400).json({ error: { code: 'MALFORMED_JSON', message: 'The request body is not valid JSON' } });
    return;
  }
  if (parserError.type === 'entity.too.large') {
    res.status(413).json({ error: { code: 'TOO_LARGE', message: 'The request body is too large' } });
    return;
  }
  if ((error as { code?: string }).code === 'EBADCSRFTOKEN' || parserError.status === 403) {
    res.status(403).json({ error: { code: 'CSRF', message: 'The form expired; reload the page and try again' } });
    return;
  }
  // Any other refusal of the request as sent (an unknown character set or content encoding, a
  // body cut off in transit): the client's fault, said as such, never a server failure.
  if (typeof parserError.status === 'number' && parserError.status >= 400 && parserError.status < 500) {
    res.status(parserError.status).json({ error: { code: 'BAD_REQUEST', message: 'The request could not be read as sent; reload the page and try again' } });
    return;
  }
  // Logged once, by the request's own line (pino-http writes `res.err` with its stack, the request
  // id, the person and the route); the answer carries the id so a person can quote it.
  (res as typeof res & { err?: unknown }).err = error;
  const requestId = (req as typeof req & { id?: unknown }).id;
  res.status(500).json({ error: { code: 'INTERNAL', message: 'Something went wrong on the server; nothing was saved', requestId } });
};
