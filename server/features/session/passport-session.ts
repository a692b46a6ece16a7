// passport and express-session as promises: the sign-in check, the session it starts, and its end.
import type { Request, Response } from 'express';
import passport from 'passport';

export function authenticate(req: Request, res: Response): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: Express.User | false) =>
      error ? reject(error) : resolve(user),
    )(req, res, reject);
  });
}

export function logIn(req: Request, user: Express.User): Promise<void> {
  // passport regenerates the session id here, so a fixed pre-sign-in id is useless.
  return new Promise((resolve, reject) => req.logIn(user, (error) => (error ? reject(error) : resolve())));
}

/** Signs out and deletes the session from the store. */
export function signOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => {
    req.logout((error) => {
      if (error) return reject(error);
      req.session.destroy((destroyError) => (destroyError ? reject(destroyError) : resolve()));
    });
  });
}
