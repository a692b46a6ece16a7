// The one fetch wrapper: JSON in and out, the CSRF header on writes, typed errors.

export type FieldErrors = Record<string, string>;

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldErrors = {},
    /** Anything else the server sent for the form to act on (e.g. what to confirm). */
    readonly details?: unknown,
    /** The server's id of the request (X-Request-Id), which its log lines carry. */
    readonly requestId?: string,
  ) {
    super(message);
  }
}

/**
 * A server failure's message ends with the request's reference, so the person can quote it to
 * whoever reads the server's log; answers about the input itself (4xx) say what to change instead.
 */
export function withReference(message: string, status: number, requestId: string | null | undefined): string {
  if (status < 500 || !requestId) return message;
  return `${message} (reference ${requestId})`;
}

let csrfToken: string | null = null;
export function rememberCsrfToken(token: string) {
  csrfToken = token;
}
async function ensureCsrfToken(): Promise<string> {
  if (csrfToken) return csrfToken;
  let response: Response;
  try {
    response = await fetch('/api/session/csrf', { credentials: 'same-origin' });
  } catch {
    // Said like any other request that never reached the server, so callers can tell (the offline queue keeps the record).
    throw new ApiError(0, 'NETWORK', 'The server could not be reached; check the connection and try again');
  }
  // A proxy's error page (the app down behind it) is not JSON: said as its status, like any answer.
  const body = (await response.json().catch(() => null)) as { csrfToken?: string } | null;
  if (!response.ok || !body?.csrfToken) throw new ApiError(response.ok ? 502 : response.status, 'NO_TOKEN', `The server answered ${response.status} without a form token; try again`);
  csrfToken = body.csrfToken;
  return csrfToken;
}

/** Called with the path the user was on when the server says they are signed out. */
let onSignedOut: (() => void) | null = null;
export function setSignedOutHandler(handler: () => void) {
  onSignedOut = handler;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

async function send<T>(method: Method, path: string, body?: unknown, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers['X-CSRF-Token'] = await ensureCsrfToken();
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'NETWORK', 'The server could not be reached; check the connection and try again');
  }
  if (response.status === 204) return undefined as T;
  const payload = (await response.json().catch(() => null)) as
    | { error?: { code: string; message: string; fields?: FieldErrors; details?: unknown } }
    | null;
  if (response.ok) return payload as T;
  const error = payload?.error;
  const requestId = response.headers.get('X-Request-Id') ?? undefined;
  if (response.status === 403 && error?.code === 'CSRF' && !retried) {
    // The session was renewed elsewhere (sign-in, restart): fetch a fresh token once.
    csrfToken = null;
    return send<T>(method, path, body, true);
  }
  if (response.status === 401 && path !== '/api/session' && path !== '/api/me') onSignedOut?.();
  throw new ApiError(
    response.status,
    error?.code ?? 'HTTP_' + response.status,
    withReference(error?.message ?? `The server answered ${response.status}`, response.status, requestId),
    error?.fields ?? {},
    error?.details,
    requestId,
  );
}

export const api = {
  get: <T>(path: string) => send<T>('GET', path),
  post: <T>(path: string, body?: unknown) => send<T>('POST', path, body ?? {}),
  patch: <T>(path: string, body: unknown) => send<T>('PATCH', path, body),
  put: <T>(path: string, body: unknown) => send<T>('PUT', path, body),
  delete: <T>(path: string) => send<T>('DELETE', path),
  /** multipart/form-data (file uploads); the browser sets the boundary. */
  upload: <T>(path: string, form: FormData) => send<T>('POST', path, form),
};
