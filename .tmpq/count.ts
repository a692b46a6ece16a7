import http from 'node:http';
import { QueryTypes } from 'sequelize';
import { createSequelize } from '../server/db/sequelize';
import { initModels } from '../server/db/models';
import { createMigrator } from '../server/db/migrator';
import { seedDemo } from '../server/db/seed/seed-demo';
import people from '../server/db/seed/demo-people.json';
import { createApp } from '../server/app';
// @ts-expect-error js
import { startPrivateMariaDb } from '../scripts/lib/private-mariadb.mjs';
import { httpCall, type Session } from '../scripts/lib/http-call';
import pino from 'pino';

const db = await startPrivateMariaDb({ dataDir: '.data/tmpq', port: 3433, databases: ['hq'], fresh: true, label: 'tmpq' });
const url = db.urlFor('hq');
const sequelize = createSequelize(url);
initModels(sequelize);
await createMigrator(sequelize).up();
await seedDemo(sequelize);
const unitIds = (await sequelize.query<{ id: number }>('SELECT id FROM units ORDER BY id', { type: QueryTypes.SELECT })).map((u) => u.id);
const built = createApp(sequelize, { sessionSecret: 'x'.repeat(40), behindHttpsProxy: false, smtpUrl: 'smtp://127.0.0.1:9', publicUrl: 'http://x' , signInLimits: undefined}, { logger: pino({ level: 'silent' }) });
const server = http.createServer(built.app);
await new Promise<void>((r) => server.listen(5197, '127.0.0.1', r));
const agent = new http.Agent({ keepAlive: true });
const base = 'http://127.0.0.1:5197';
const call = (m: string, p: string, s: Session | null, b?: unknown) => httpCall(agent, base, m, p, s, b);
const writer = people.users.find((u) => u.role === 'operator')!.email;
const s: Session = { cookie: '', csrf: '' };
const c = await call('GET', '/api/session/csrf', s);
if (c.setCookie?.[0]) s.cookie = c.setCookie[0].split(';')[0]!;
s.csrf = JSON.parse(c.text).csrfToken;
const r = await call('POST', '/api/session', s, { email: writer, password: people.password });
if (r.setCookie?.[0]) s.cookie = r.setCookie[0].split(';')[0]!;
s.csrf = JSON.parse(r.text).csrfToken;
let log: string[] = [];
sequelize.options.logging = (sql: string) => { log.push(sql.slice(0, 400)); };
const unit = unitIds[0]!;
const actions: [string, () => Promise<{ status: number }>][] = [
  ['me', () => call('GET', '/api/me', s)],
  ['board', () => call('GET', `/api/units/${unit}/handovers/current`, s)],
  ['log', () => call('GET', `/api/units/${unit}/log?limit=50`, s)],
  ['overview', () => call('GET', '/api/overview', s)],
  ['search', () => call('GET', `/api/logbook/search?q=waterbox`, s)],
  ['log entry', () => call('POST', `/api/units/${unit}/log`, s, { position: 'control_room', category: 'operation', text: `Load test entry: checked waterbox vents`, carryToHandover: false })],
  ['round', () => call('POST', `/api/units/${unit}/readings`, s, { pressure: { value: 8.4, unit: 'kPa_a' }, hotwellTemperature: { value: 41.5, unit: 'degC' }, cwInletTemperature: { value: 21, unit: 'degC' }, cwOutletTemperature: { value: 29.9, unit: 'degC' }, cwFlow: { value: 54000, unit: 'm3_h' } })],
];
for (let pass = 0; pass < 2; pass++) for (const [name, run] of actions) {
  log = [];
  const t0 = performance.now();
  const res = await run();
  await new Promise((r) => setTimeout(r, 50));
  console.log(`\n### ${name} pass ${pass} status ${res.status} ${(performance.now() - t0 - 50).toFixed(1)} ms, ${log.length} queries`);
  if (pass === 1 && process.env.SHOW) for (const q of log) console.log('   ', q.replace(/\s+/g, ' ').slice(0, 260));
}
// timing loop: CPU per action
for (const [name, run] of actions) {
  const t0 = performance.now(); const c0 = process.cpuUsage();
  for (let i = 0; i < 100; i++) await run();
  const cpu = process.cpuUsage(c0);
  console.log(`${name}: ${((performance.now() - t0) / 100).toFixed(2)} ms wall, ${((cpu.user + cpu.system) / 1000 / 100).toFixed(2)} ms cpu (incl client)`);
}
server.close(); built.close(); await sequelize.close(); await db.stop(); process.exit(0);
