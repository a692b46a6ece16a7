// Structured logs: one JSON line per event on stdout (pino), for the service manager's journal or
// a log collector. Every request's line carries its request id, the signed-in person and the route;
// secrets never reach a line (cookies, the CSRF token, passwords, authorization headers).
import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { Request, Response } from 'express';
import { pino, type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';

export type { Logger };

const censored = [
  'req.headers.cookie',
  'req.headers.authorization',
  'req.headers["x-csrf-token"]',
  'res.headers["set-cookie"]',
  'headers.cookie',
  'headers.authorization',
  'password',
  'temporaryPassword',
  'currentPassword',
  'newPassword',
  'sessionSecret',
  'databaseUrl',
  '*.password',
  '*.temporaryPassword',
  '*.currentPassword',
  '*.newPassword',
  '*.sessionSecret',
  '*.databaseUrl',
];

export function createLogger(options: { level?: string; destination?: DestinationStream } = {}): Logger {
  return pino(
    {
      level: options.level ?? process.env.LOG_LEVEL ?? 'info',
      base: { pid: process.pid },
      timestamp: pino.stdTimeFunctions.isoTime,
      redact: { paths: censored, censor: '[redacted]' },
      serializers: { err: pino.stdSerializers.err },
    },
    options.destination,
  );
}

/**
 * The process's logger for code that runs outside a request (loops, retries). The server replaces
 * its level from the checked configuration at start; tests quiet it with LOG_LEVEL=silent.
 */
export const logger: Logger = createLogger();

/** An incoming X-Request-Id is kept when it looks like an id (a proxy's, a caller's); else one is made. */
const SANE_REQUEST_ID = /^[A-Za-z0-9._:-]{6,128}$/;

export function requestIdFor(req: IncomingMessage, res: ServerResponse): string {
  const incoming = req.headers['x-request-id'];
  const id = typeof incoming === 'string' && SANE_REQUEST_ID.test(incoming) ? incoming : randomUUID();
  res.setHeader('X-Request-Id', id);
  return id;
}

/** The route pattern that answered (`/api/units/:unitId/readings`), not the address with its ids. */
function routeOf(req: Request, res: Response): string | undefined {
  const route = (req as Request & { route?: { path?: unknown } }).route;
  if (!route || typeof route.path !== 'string') return undefined;
  return `${(res.locals.routeBase as string | undefined) ?? req.baseUrl ?? ''}${route.path}`;
}

/**
 * Remembers where a router is mounted: Express forgets `baseUrl` once a handler passes an error on,
 * and the request's line is written after that.
 */
export function markRouteBase(req: Request, res: Response, next: () => void) {
  res.locals.routeBase = req.baseUrl;
  next();
}

/** Probes answer every second or two from each balancer: their lines would drown the rest. */
const PROBES = new Set(['/api/health', '/api/ready']);

export function httpLogger(log: Logger) {
  return pinoHttp({
    logger: log,
    genReqId: requestIdFor,
    autoLogging: { ignore: (req) => PROBES.has((req.url ?? '').split('?')[0]!) },
    customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : 'info'),
    customProps: (req, res) => ({
      userId: (req as Request).user?.id,
      route: routeOf(req as Request, res as Response),
    }),
    serializers: {
      req: (req: { id?: unknown; method?: string; url?: string; remoteAddress?: string }) => ({
        id: req.id,
        method: req.method,
        url: req.url,
        remoteAddress: req.remoteAddress,
      }),
      res: (res: { statusCode?: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
