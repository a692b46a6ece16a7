import { Router, type Request, type RequestHandler, type Response } from 'express';
import passport from 'passport';
import { rateLimit } from 'express-rate-limit';
import { changePasswordSchema, signInSchema } from '../../../shared/schemas/auth';
import { SIGN_IN_FAILED, authorize } from '../../lib/auth';
import { HttpError } from '../../lib/errors';
import { parseInput } from '../../lib/validate';
import { getPublicUser, type UserService } from '../users/service';

type Csrf = { generateToken: (req: Request, overwrite?: boolean) => string };

function authenticate(req: Request, res: Response): Promise<Express.User | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: Express.User | false) =>
      error ? reject(error) : resolve(user),
    )(req, res, reject);
  });
}

function logIn(req: Request, user: Express.User): Promise<void> {
  // passport regenerates the session id here, so a fixed pre-sign-in id is useless.
  return new Promise((resolve, reject) => req.logIn(user, (error) => (error ? reject(error) : resolve())));
}

export function sessionRoutes(users: UserService, csrf: Csrf, signInLimit: number, onSignedOut: (sessionId: string) => void = () => {}): Router {
  const router = Router();

  const signInLimiter: RequestHandler = rateLimit({
    windowMs: 15 * 60 * 1000,
    limit: signInLimit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: 'Too many sign-in attempts; wait 15 minutes and try again' } });
    },
  });

  router.get('/session/csrf', (req, res) => {
    res.json({ csrfToken: csrf.generateToken(req) });
  });

  router.post('/session', signInLimiter, async (req, res) => {
    // passport reads the body, so it must read the parsed one (the e-mail trimmed of spaces).
    req.body = parseInput(signInSchema, req.body);
    const user = await authenticate(req, res);
    if (!user) throw new HttpError(401, 'SIGN_IN_FAILED', SIGN_IN_FAILED);
    await logIn(req, user);
    res.json({ user: await getPublicUser(user.id), csrfToken: csrf.generateToken(req, true) });
  });

  router.delete('/session', (req, res, next) => {
    const sessionId = req.sessionID;
    req.logout((error) => {
      if (error) return next(error);
      req.session.destroy((destroyError) => {
        if (destroyError) return next(destroyError);
        res.clearCookie('hotwell.sid');
        // A tab left open elsewhere on this session stops hearing the unit's events at once.
        onSignedOut(sessionId);
        res.status(204).end();
      });
    });
  });

  const signedInEvenIfPasswordPending = authorize(undefined, { allowPendingPasswordChange: true });

  router.get('/me', signedInEvenIfPasswordPending, async (req, res) => {
    res.json({ user: await getPublicUser(req.user!.id) });
  });

  router.post('/me/password', signedInEvenIfPasswordPending, async (req, res) => {
    const input = parseInput(changePasswordSchema, req.body);
    await users.changeOwnPassword(req.user!.id, input);
    res.json({ user: await getPublicUser(req.user!.id) });
  });

  return router;
}
