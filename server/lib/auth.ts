// Sign-in (passport-local) and the one policy helper every route uses.
import argon2 from 'argon2';
import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request, RequestHandler } from 'express';
import { takeSessionPerson } from './session-store';
import type { Role } from '../../shared/roles';
import { rolesFor, type Action } from '../../shared/policies/permissions';
import { User } from '../features/users/model';
import { Forbidden, Unauthorized } from './errors';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface User {
      id: number;
      name: string;
      email: string;
      role: Role;
      crewId: number | null;
      mustChangePassword: boolean;
    }
  }
}

/** Same words for an unknown e-mail and a wrong password, so neither is revealed. */
export const SIGN_IN_FAILED = 'That e-mail and password do not match an active account';

// Verified against when the e-mail is unknown, so both failures take the same time.
let decoyHash: Promise<string> | null = null;

export function hashPassword(plain: string): Promise<string> {
  return argon2.hash(plain, { type: argon2.argon2id });
}

export async function verifyCredentials(email: string, password: string): Promise<User | null> {
  const user = await User.findOne({ where: { email: email.toLowerCase() } });
  if (!user) {
    decoyHash ??= hashPassword('decoy password that never matches');
    await argon2.verify(await decoyHash, password).catch(() => false);
    return null;
  }
  const ok = await argon2.verify(user.passwordHash, password).catch(() => false);
  return ok && user.active ? user : null;
}

function toSessionUser(user: Pick<User, 'id' | 'name' | 'email' | 'role' | 'crewId' | 'mustChangePassword'>): Express.User {
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    role: user.role,
    crewId: user.crewId,
    mustChangePassword: Boolean(user.mustChangePassword), // a plain row carries MariaDB's 0/1
  };
}

export function configurePassport() {
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      verifyCredentials(email, password)
        .then((user) => done(null, user ? toSessionUser(user) : false))
        .catch(done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // Read fresh on every request so a role change or deactivation applies at once: the session
  // store reads the person with the session (one query); only without that row is it asked again.
  passport.deserializeUser((req: Request, id: number, done: (error: unknown, user?: Express.User | false) => void) => {
    const prefetched = takeSessionPerson(req.sessionID);
    if (prefetched && prefetched.id === id) return done(null, prefetched.active ? toSessionUser(prefetched as Parameters<typeof toSessionUser>[0]) : false);
    User.findByPk(id, { raw: true, attributes: ['id', 'name', 'email', 'role', 'crewId', 'mustChangePassword', 'active'] })
      .then((user) => done(null, user && user.active ? toSessionUser(user) : false))
      .catch(done);
  });
  return passport;
}

type PolicyOptions = { allowPendingPasswordChange?: boolean };

/**
 * The policy helper: 401 when not signed in, 403 when the role is not among `allowed`
 * (no list = any signed-in role). A person who must change a temporary password can
 * reach nothing else until they have.
 */
export function authorize(allowed?: readonly Role[], options: PolicyOptions = {}): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(new Unauthorized());
    if (req.user.mustChangePassword && !options.allowPendingPasswordChange) {
      return next(new Forbidden('Change your temporary password first', 'PASSWORD_CHANGE_REQUIRED'));
    }
    if (allowed && !allowed.includes(req.user.role)) return next(new Forbidden());
    next();
  };
}

export const signedIn = authorize();

/** The roles the shared permission table gives this action (shared/policies/permissions.ts). */
export const allow = (action: Action, options: PolicyOptions = {}): RequestHandler => authorize(rolesFor(action), options);
