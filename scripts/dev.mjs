// `npm run dev`: private database, then Vite with HMR and a watching API server.
import { ensureNodeDependencies } from './lib/node-deps.mjs';
import { startPrivateMariaDb } from './lib/private-mariadb.mjs';
import { runLocalOrExit, spawnLocal } from './lib/run.mjs';

ensureNodeDependencies();
const dbPort = Number(process.env.HOTWELL_DB_PORT ?? 3417);
const apiPort = Number(process.env.API_PORT ?? 5181);
let database = null;
let databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) {
  database = await startPrivateMariaDb({ dataDir: '.data/local', port: dbPort, databases: ['hotwell'], label: 'local' });
  databaseUrl = database.urlFor('hotwell');
}
const env = { DATABASE_URL: databaseUrl };
await runLocalOrExit('tsx', ['server/db/migrate-cli.ts'], env);
await runLocalOrExit('tsx', ['server/db/seed/seed-cli.ts', '--demo'], env);
const children = [
  spawnLocal('tsx', ['watch', 'server/index.ts'], { ...env, PORT: String(apiPort), SESSION_SECRET: 'dev-only-secret' }),
  spawnLocal('vite', [], { API_PORT: String(apiPort) }),
];
const stop = async () => {
  for (const child of children) child.kill('SIGTERM');
  if (database) await database.stop();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
