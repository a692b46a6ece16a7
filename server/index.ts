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
  // With the database gone, closing the pool or a pass of the outbox can wait a long time: the
  // work is already safe (committed or not), so after a few seconds the process simply ends.
  setTimeout(() => {
    console.error('[server] shutdown took too long; exiting');
    process.exit(1);
  }, 8_000).unref();
  clearInterval(reminders);
  // Closing Socket.IO closes the HTTP server it is attached to as well; idle keep-alive connections
  // would hold that close open, so they are ended here.
  await io.close();
  server.closeAllConnections();
  await built.outbox.stop();
  built.close();
  await sequelize.close();
  process.exit(0);
}
process.on('SIGTERM', shutdown);
process.on('SIGINT', shutdown);

// Under `npm start`: should the supervising process vanish without stopping us (kill -9), stop
// rather than hold the port with nobody to stop us.
const supervisor = Number(process.env.HOTWELL_SUPERVISOR_PID);
if (supervisor) {
  setInterval(() => {
    try {
      process.kill(supervisor, 0);
    } catch {
      console.error('[server] the npm start process is gone; stopping');
      void shutdown();
    }
  }, 2_000).unref();
}
