// Starts Hotwell: database connection, HTTP server, graceful shutdown.
import http from 'node:http';
import { readConfig } from './config';
import { createSequelize } from './db/sequelize';
import { initModels } from './db/models';
import { createApp } from './app';

const config = readConfig();
const sequelize = createSequelize(config.databaseUrl);
initModels(sequelize);
await sequelize.authenticate();

const built = createApp(sequelize, config);
const server = http.createServer(built.app);
const io = built.realtime.attach(server, built.sessionMiddleware);
server.listen(config.port, config.host, () => {
  console.log(`[server] listening on http://${config.host}:${config.port}`);
});

// Notices wait in the outbox until sent: every few seconds, and at once after a commit that wrote one.
built.outbox.start(5_000);
// Reminders (late acceptance, passed deadlines) are written to the outbox once a minute.
const reminders = setInterval(() => {
  built.notices.queueDue().catch((error: unknown) => console.error('[mail] reminders not queued (will try again)', (error as Error).message));
}, 60_000);
reminders.unref();

let closing = false;
async function shutdown() {
  if (closing) return;
  closing = true;
  clearInterval(reminders);
  await built.outbox.stop();
  await io.close();
  server.close();
  server.closeAllConnections();
  built.close();
  await sequelize.close();
  process.exit(0);
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);
