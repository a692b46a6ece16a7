// Builds the Express app without listening, so tests can drive it in-process.
import express, { type RequestHandler } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { DEFAULT_ANONYMOUS_TOKEN_LIMIT, type AppConfig } from './config';
import { createCsrf } from './lib/csrf';
import { defaultSignInLimits, makeSignInLimits } from './features/session/sign-in-limits';
import { configurePassport } from './lib/auth';
import { createSessionStore } from './lib/session-store';
import { NotFound, errorMiddleware } from './lib/errors';
import { sessionRoutes } from './features/session/routes';
import { adminUserRoutes } from './features/users/routes';
import { makeUserService } from './features/users/service';
import { adminAuditRoutes } from './features/audit/routes';
import { plantRoutes } from './features/plant/routes';
import { calcRoutes } from './features/calc/routes';
import { makeVersionService } from './features/plant/versions';
import { makeEquipmentService } from './features/plant/service';
import { makeReadingService } from './features/readings/service';
import { readingRoutes } from './features/readings/routes';
import { makeFlagService } from './features/flags/service';
import { flagRoutes } from './features/flags/routes';
import { trendRoutes } from './features/trends/routes';
import { makeTrendService } from './features/trends/service';
import { makeImportService } from './features/imports/service';
import { importRoutes } from './features/imports/routes';
import { createRealtimeHub, type RealtimeHub } from './lib/realtime';
import { connectLiveUpdates } from './lib/live';
import { makeLogService } from './features/log/service';
import { logRoutes } from './features/log/routes';
import { makeStandingOrderService } from './features/standing-orders/service';
import { standingOrderRoutes } from './features/standing-orders/routes';
import { makeConditionService } from './features/conditions/service';
import { conditionRoutes } from './features/conditions/routes';
import { makeHandoverService } from './features/handovers/service';
import { handoverRoutes } from './features/handovers/routes';
import { makeNotices, type Notices } from './features/handovers/notices';
import { createMailer, type Mailer } from './lib/mailer';
import { makeOutboxSender, type OutboxOptions, type OutboxSender } from './lib/outbox';
import { storageFor, type Storage } from './lib/storage';
import { httpLogger, logger as processLogger, markRouteBase, type Logger } from './lib/logger';
import { makeReadiness, type Readiness } from './lib/readiness';
import type { RedisClient } from './lib/redis';
import { attachmentRoutes } from './features/attachments/routes';
import { makeAttachmentService } from './features/attachments/service';
import { shiftRoutes } from './features/shifts/routes';
import { makeShiftService } from './features/shifts/service';
import { logbookRoutes } from './features/logbook/routes';
import { makeReviewCommentService } from './features/logbook/review-comments';
import { makeLogbookService } from './features/logbook/service';
import { trainingRoutes } from './features/training/routes';
import { makeTrainingService } from './features/training/service';
import { shiftCondenserRoutes } from './features/shift-condenser/routes';
import { handoverHeaderRoutes } from './features/handovers/record-header';
import { makeShiftCondenserService } from './features/shift-condenser/service';
import { stationRoutes } from './features/stations/routes';
import { makeStationService } from './features/stations/service';
import { overviewRoutes } from './features/overview/routes';
import { makeOverviewService } from './features/overview/service';
import { builtAssets } from './lib/built-assets';


export type BuiltApp = {
  app: express.Express;
  /** The same session middleware, for the Socket.IO handshake. */
  sessionMiddleware: RequestHandler;
  /** Emits after commits; `attach` it to the HTTP server to reach browsers. */
  realtime: RealtimeHub;
  /** E-mail notices; `queueDue` (reminders) is run on a timer by the server. */
  notices: Notices;
  /** Sends what the notices wrote to the outbox; the server `start`s its loop. */
  outbox: OutboxSender;
  /** What `/api/ready` answers; the server starts draining it on SIGTERM. */
  readiness: Readiness;
  close: () => void;
};

export function createApp(
  sequelize: Sequelize,
  config: Pick<AppConfig, 'sessionSecret' | 'behindHttpsProxy' | 'smtpUrl' | 'publicUrl'> &
    Partial<Pick<AppConfig, 'signInLimits' | 'anonymousTokenLimit' | 'storage'>>,
  deps: {
    storage?: Storage;
    importBatchRows?: number;
    mailer?: Mailer;
    outbox?: OutboxOptions;
    logger?: Logger;
    /** Shared by every node: the sign-in form limit counts there (else in this process). */
    redis?: RedisClient;
  } = {},
): BuiltApp {
  const app = express();
  // First, so every line (errors included) carries the request id, and the answer returns it.
  app.use(httpLogger(deps.logger ?? processLogger));
  // A router mounted with `mount` is named by its pattern on the request's log line.
  const mount = (prefix: string, router: express.Router) => app.use(prefix, markRouteBase, router);
  const passport = configurePassport();
  if (config.behindHttpsProxy) app.set('trust proxy', 1);
  app.disable('x-powered-by');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: { 'upgrade-insecure-requests': config.behindHttpsProxy ? [] : null },
      },
      // Plain-HTTP loopback serving must not be told to switch to HTTPS.
      strictTransportSecurity: config.behindHttpsProxy,
    }),
  );
  // Answers about people and plant state are never for a shared cache or the browser's history.
  app.use('/api', (_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  app.use(express.json({ limit: '1mb' }));

  // Probes for the service manager and the balancer: before sessions, so they never touch one.
  const readiness = makeReadiness(sequelize);
  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });
  app.get('/api/ready', async (_req, res) => {
    const answer = await readiness.check();
    res.status(answer.ready ? 200 : 503).json(answer);
  });

  const store = createSessionStore(sequelize);
  const sessionMiddleware = session({
    name: 'hotwell.sid',
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.behindHttpsProxy,
      maxAge: 13 * 60 * 60 * 1000, // one long shift plus handover
    },
  });
  app.use(sessionMiddleware);
  app.use(passport.initialize());
  app.use(passport.session());

  const csrf = createCsrf({ secret: config.sessionSecret, secureCookies: config.behindHttpsProxy });
  app.use('/api', csrf.csrfSynchronisedProtection);

  const users = makeUserService(sequelize);
  const realtime = createRealtimeHub();
  const disconnectLive = connectLiveUpdates(sequelize, realtime);
  const outbox = makeOutboxSender(sequelize, deps.mailer ?? createMailer(config.smtpUrl), deps.outbox);
  const notices = makeNotices(sequelize, outbox, config.publicUrl ?? 'http://127.0.0.1:5180');
  mount(
    '/api',
    sessionRoutes({
      users,
      csrf,
      signInLimits: makeSignInLimits(sequelize, config.signInLimits ?? defaultSignInLimits),
      anonymousTokenLimit: config.anonymousTokenLimit ?? DEFAULT_ANONYMOUS_TOKEN_LIMIT,
      redis: deps.redis,
      onSignedOut: (sessionId) => realtime.disconnect({ sessionId }),
    }),
  );
  mount('/api/admin/users', adminUserRoutes(users));
  mount('/api/admin/audit-events', adminAuditRoutes());
  mount('/api/plant', plantRoutes(makeVersionService(sequelize), makeEquipmentService(sequelize)));
  mount('/api', readingRoutes(makeReadingService(sequelize)));
  mount('/api', flagRoutes(makeFlagService(sequelize)));
  mount('/api', trendRoutes(makeTrendService(sequelize)));
  mount('/api', importRoutes(makeImportService(sequelize, { batchRows: deps.importBatchRows })));
  const log = makeLogService(sequelize);
  mount('/api', stationRoutes(makeStationService(sequelize)));
  mount('/api', logRoutes(log));
  mount('/api', standingOrderRoutes(makeStandingOrderService(sequelize)));
  mount('/api', conditionRoutes(makeConditionService(sequelize, log)));
  const handovers = makeHandoverService(sequelize, notices);
  mount('/api', handoverRoutes(handovers));
  mount('/api', attachmentRoutes(makeAttachmentService(sequelize, deps.storage ?? storageFor(config.storage), handovers)));
  mount('/api', shiftRoutes(makeShiftService(sequelize)));
  const reviewComments = makeReviewCommentService(sequelize);
  mount('/api', logbookRoutes(makeLogbookService(sequelize), reviewComments));
  mount('/api', trainingRoutes(makeTrainingService(sequelize)));
  mount('/api', shiftCondenserRoutes(makeShiftCondenserService(sequelize)));
  mount('/api', handoverHeaderRoutes());
  mount('/api', overviewRoutes(makeOverviewService(sequelize, { reviewCommentsFor: reviewComments.forPerson })));
  mount('/api/calc', calcRoutes());
  app.use('/api', (_req, _res, next) => next(new NotFound('That API route')));

  const root = process.cwd();
  app.use('/fonts', express.static(path.join(root, 'fonts'), { maxAge: '30d', immutable: true }));
  // A built file that is not there (an old page asking for a chunk of the previous build) is a 404,
  // never the single page: a browser would refuse that HTML as a script, and an offline cache keep it.
  app.use('/assets', ...builtAssets(path.join(root, 'dist', 'assets')), (_req: express.Request, _res: express.Response, next: express.NextFunction) => next(new NotFound('That built file')));
  app.use(express.static(path.join(root, 'dist'), { index: false }));
  // Client-side routes all load the single page.
  app.get(/^\/(?!api\/).*/, (_req, res, next) => {
    res.sendFile(path.join(root, 'dist', 'index.html'), (error) => {
      if (error) next(new NotFound('The built client (run npm start, which builds it)'));
    });
  });
  app.use(errorMiddleware);

  const close = () => {
    store.stopExpiringSessions();
    disconnectLive();
  };
  return { app, sessionMiddleware, realtime, notices, outbox, readiness, close };
}
