// Starts one Hotwell node: checked configuration, database, Redis when configured, HTTP and live
// updates, the outbox and reminder loops; stops it by draining (see lib/shutdown.ts). Production
// runs the compiled form (`npm run build`, then `npm run serve`); it never loads demo data.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { ConfigError, readConfig, type AppConfig } from './config';
import { createSequelize } from './db/sequelize';
import { initModels } from './db/models';
import { createApp } from './app';
import { logger } from './lib/logger';
import { every } from './lib/periodic';
import { connectRedis, type SharedRedis } from './lib/redis';
import { makeShutdown } from './lib/shutdown';

// A bug that escapes every handler leaves the process in an unknown state: say so and stop, and
// let the service manager start a fresh one.
process.on('unhandledRejection', (reason) => {
  logger.fatal({ err: reason }, 'unhandled promise rejection; exiting');
  process.exit(1);
});
process.on('uncaughtException', (error) => {
  logger.fatal({ err: error }, 'uncaught exception; exiting');
  process.exit(1);
});

let config: AppConfig;
try {
  config = readConfig();
} catch (error) {
  if (!(error instanceof ConfigError)) throw error;
  // For the person starting it: plain text on stderr, and the same as a log line for the journal.
  process.stderr.write(`${error.message}\n`);
  logger.fatal({ problems: error.problems }, 'configuration invalid');
  process.exit(1);
}
logger.level = config.logLevel;

const sequelize = createSequelize(config.databaseUrl);
initModels(sequelize);
try {
  await sequelize.authenticate();
} catch (error) {
  logger.fatal({ err: error }, 'the database does not answer (DATABASE_URL)');
  process.exit(1);
}

let redis: SharedRedis | undefined;
if (config.redisUrl) {
  try {
    redis = await connectRedis(config.redisUrl, logger);
  } catch (error) {
    logger.fatal({ err: error }, 'Redis does not answer (REDIS_URL)');
    process.exit(1);
  }
}

const built = createApp(sequelize, config, { logger, redis: redis?.client });
const server = http.createServer(built.app);
// Node closes a kept-alive connection after 5 s idle; a client (a browser, the balancer, the load
// benchmark's 200 people) that reuses it at that instant gets a reset instead of an answer. Idle
// connections are kept longer than the usual 60 s of balancers and proxies, as is common practice.
server.keepAliveTimeout = 65_000;
server.headersTimeout = 66_000;
const io = built.realtime.attach(server, built.sessionMiddleware, { adapter: redis?.adapter });
server.on('error', (error) => {
  logger.fatal({ err: error, port: config.port, host: config.host }, 'cannot listen (PORT, HOST)');
  process.exit(1);
});
server.listen(config.port, config.host, () => {
  const { port } = server.address() as AddressInfo;
  logger.info({ port, host: config.host, nodes: redis ? 'shared through Redis' : 'single' }, `listening on http://${config.host}:${port}`);
});
const readiness = await built.readiness.check();
if (!readiness.ready) logger.warn({ reason: readiness.reason }, 'not ready yet: /api/ready answers 503 until this is put right');

// Notices wait in the outbox until sent: every few seconds, and at once after a commit that wrote one.
built.outbox.start(config.outboxIntervalMs);
// Reminders (late acceptance, passed deadlines) are written to the outbox; every node looks, and
// the guarded mark in the database lets exactly one of them write each reminder.
const reminders = every(config.reminderIntervalMs, 'reminder check', () => built.notices.queueDue(), logger);

const { shutdown } = makeShutdown({
  server,
  io,
  log: logger,
  graceMs: config.shutdownGraceMs,
  startDraining: built.readiness.startDraining,
  stopJobs: () => Promise.all([reminders.stop(), built.outbox.stop()]),
  async closeResources() {
    built.close();
    await redis?.close();
    await sequelize.close();
  },
  exit: (code) => process.exit(code),
});
process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));

// Under `npm start`: should the supervising process vanish without stopping us (kill -9), stop
// rather than hold the port with nobody to stop us.
if (config.supervisorPid) {
  const supervisor = config.supervisorPid;
  setInterval(() => {
    try {
      process.kill(supervisor, 0);
    } catch {
      void shutdown('the npm start process is gone');
    }
  }, 2_000).unref();
}
