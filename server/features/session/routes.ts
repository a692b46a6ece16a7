import { Router, type Request, type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { RedisStore } from 'rate-limit-redis';
import type { RedisClient } from '../../lib/redis';
import { changePasswordSchema, signInSchema } from '../../../shared/schemas/auth';
import { SIGN_IN_FAILED, authorize } from '../../lib/auth';
import { hasSignedInSession } from '../../lib/csrf';
import { HttpError } from '../../lib/errors';
import { parseInput } from '../../lib/validate';
import { getPublicUser, type UserService } from '../users/index';
import { authenticate, logIn, signOut } from './passport-session';
import { isRefusal, type SignInLimiter } from './sign-in-limits';

type Csrf = { generateToken: (req: Request, overwrite?: boolean) => string };
type Deps = {
  users: UserService;
  csrf: Csrf;
  signInLimits: SignInLimiter;
  /** Sign-in forms (CSRF tokens) handed out per minute per address before sign-in. */
  anonymousTokenLimit: number;
  onSignedOut?: (sessionId: string) => void;
  /** With several app nodes: the form limit counts in Redis, so it holds whichever node answers. */
  redis?: RedisClient;
};

const addressOf = (req: Request) => req.ip ?? req.socket.remoteAddress ?? 'unknown';

export function sessionRoutes({ users, csrf, signInLimits, anonymousTokenLimit, onSignedOut = () => {}, redis }: Deps): Router {
  const router = Router();

  // Handing out a token stores nothing now, but a flood of them still costs CPU: a ceiling per address.
  const tokenLimiter: RequestHandler = rateLimit({
    windowMs: 60 * 1000,
    limit: anonymousTokenLimit,
    skip: hasSignedInSession,
    ...(redis && {
      store: new RedisStore({ prefix: 'hotwell:sign-in-forms:', sendCommand: (...args: string[]) => redis.sendCommand(args) as Promise<number> }),
      // Redis away: forms are handed out unlimited rather than nobody being able to sign in; the
      // per-account and per-address sign-in limits (in MariaDB) still hold.
      passOnStoreError: true,
    }),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'RATE_LIMITED', message: 'Too many sign-in forms opened from this computer; wait a minute and try again' } });
    },
  });

  router.get('/session/csrf', tokenLimiter, (req, res) => {
    res.json({ csrfToken: csrf.generateToken(req) });
  });

  router.post('/session', async (req, res) => {
    // passport reads the body, so it must read the parsed one (the e-mail trimmed of spaces).
    const input = parseInput(signInSchema, req.body);
    req.body = input;
    const attempt = await signInLimits.begin(input.email, addressOf(req));
    if (isRefusal(attempt)) {
      res.setHeader('Retry-After', String(attempt.retryAfterSeconds));
      throw new HttpError(429, 'SIGN_IN_LOCKED', attempt.message);
    }
    const user = await authenticate(req, res);
    if (!user) throw new HttpError(401, 'SIGN_IN_FAILED', SIGN_IN_FAILED);
    await attempt.succeeded();
    await logIn(req, user);
    res.json({ user: await getPublicUser(user.id), csrfToken: csrf.generateToken(req, true) });
  });

  router.delete('/session', async (req, res) => {
    const sessionId = req.sessionID;
    await signOut(req);
    res.clearCookie('hotwell.sid');
    // A tab left open elsewhere on this session stops hearing the unit's events at once.
    onSignedOut(sessionId);
    res.status(204).end();
  });

  const signedInEvenIfPasswordPending = authorize(undefined, { allowPendingPasswordChange: true });

  router.get('/me', signedInEvenIfPasswordPending, async (req, res) => {
    res.json({ user: await getPublicUser(req.user!.id) });
  });

  router.post('/me/password', signedInEvenIfPasswordPending, async (req, res) => {
    const input = parseInput(changePasswordSchema, req.body);
    await users.changeOwnPassword(req.user!.id, input, req.sessionID);
    res.json({ user: await getPublicUser(req.user!.id) });
  });

  return router;
}
