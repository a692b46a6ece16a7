// CSRF protection: csrf-sync's synchroniser token, kept in the session once someone has signed in.
// Before sign-in there is no session to keep it in, and making one per visitor (a stored row for
// every GET of the token) let anyone fill the sessions table; so, through csrf-sync's own
// getTokenFromState / storeTokenInState options, an anonymous visitor's token lives in a cookie of
// its own, HMAC-signed with the session secret: the header must repeat the token, and the cookie
// must carry the server's signature of it, so neither a forged cookie nor another visitor's token
// passes. At sign-in passport regenerates the session and a fresh token goes into it.
import { createHmac, timingSafeEqual } from 'node:crypto';
import type { Request } from 'express';
import { csrfSync } from 'csrf-sync';

type Options = { secret: string; secureCookies: boolean };

/** The person's session exists (signed in); before that nothing is stored server-side. */
export const hasSignedInSession = (req: Request) => (req.session as { passport?: { user?: unknown } } | undefined)?.passport?.user !== undefined;

function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const at = part.indexOf('=');
    if (at > 0 && part.slice(0, at).trim() === name) {
      try {
        return decodeURIComponent(part.slice(at + 1).trim());
      } catch {
        return undefined;
      }
    }
  }
  return undefined;
}

export function createCsrf({ secret, secureCookies }: Options) {
  // The __Host- prefix (HTTPS only) stops a neighbouring subdomain from planting its own cookie.
  const cookieName = secureCookies ? '__Host-hotwell.csrf' : 'hotwell.csrf';
  const sign = (token: string) => createHmac('sha256', secret).update(`anonymous-csrf:${token}`).digest('base64url');
  const signatureMatches = (token: string, signature: string) => {
    const expected = Buffer.from(sign(token));
    const given = Buffer.from(signature);
    return given.length === expected.length && timingSafeEqual(given, expected);
  };

  return csrfSync({
    getTokenFromRequest: (req) => req.get('x-csrf-token'),
    getTokenFromState: (req) => {
      if (hasSignedInSession(req)) return req.session.csrfToken;
      const [token, signature] = (readCookie(req, cookieName) ?? '').split('.');
      return token && signature && signatureMatches(token, signature) ? token : undefined;
    },
    storeTokenInState: (req, token) => {
      if (hasSignedInSession(req)) {
        req.session.csrfToken = token;
        return;
      }
      const options = { httpOnly: true, sameSite: 'strict' as const, secure: secureCookies, path: '/' };
      if (token) req.res?.cookie(cookieName, `${token}.${sign(token)}`, options);
      else req.res?.clearCookie(cookieName, options);
    },
    errorConfig: { statusCode: 403, code: 'EBADCSRFTOKEN', message: 'Invalid CSRF token' },
  });
}
export type Csrf = ReturnType<typeof createCsrf>;
