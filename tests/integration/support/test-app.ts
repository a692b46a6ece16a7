// Integration-test harness: the real app, in-process, against the real MariaDB test database.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { createApp, type BuiltApp } from '../../../server/app';
import { defaultSignInLimits, type SignInLimits } from '../../../server/features/session/sign-in-limits';
import { createSequelize } from '../../../server/db/sequelize';
import { initModels } from '../../../server/db/models';
import { hashPassword } from '../../../server/lib/auth';
import { User } from '../../../server/features/users/model';
import { Crew, LimitSetVersion, PlantUnit, PlausibleRangeVersion, Station, UnitDesignVersion } from '../../../server/features/plant/model';
import { startingLimits, type LimitSet } from '../../../shared/calc/limits';
import type { PlausibleRanges } from '../../../shared/calc/plausibility';
import { widestPlausibleRanges } from '../../fixtures/widest-plausible-ranges';
import { handBuiltDesign } from '../../fixtures/hand-built-design';
import type { Role } from '../../../shared/roles';

const url = process.env.TEST_DATABASE_URL;
if (!url) throw new Error('TEST_DATABASE_URL is not set: run the integration tests through `npm test`.');

let sequelize: Sequelize | null = null;
export function db(): Sequelize {
  if (!sequelize) {
    sequelize = createSequelize(url!);
    initModels(sequelize);
  }
  return sequelize;
}

export const SECRET = 'integration-test-secret';
const opened: BuiltApp[] = [];

/**
 * The app as configured for a test. Every test file signs in from the same address, so its ceiling
 * of failures is lifted unless a test sets one; the per-account lock-out keeps its shipped settings.
 */
export function buildApp(options: { signInLimits?: Partial<SignInLimits>; anonymousTokenLimit?: number; smtpUrl?: string; importBatchRows?: number } = {}): BuiltApp {
  const built = createApp(
    db(),
    {
      sessionSecret: SECRET,
      behindHttpsProxy: false,
      signInLimits: { ...defaultSignInLimits, addressFailures: 10_000, ...options.signInLimits },
      anonymousTokenLimit: options.anonymousTokenLimit ?? 10_000,
      smtpUrl: options.smtpUrl,
      publicUrl: 'http://127.0.0.1:5180',
    },
    { importBatchRows: options.importBatchRows },
  );
  opened.push(built);
  return built;
}

export async function closeAll() {
  for (const built of opened.splice(0)) built.close();
  if (sequelize) await sequelize.close();
  sequelize = null;
}

let counter = 0;
export const PASSWORD = 'correct horse battery staple';

/** Creates a person with a unique e-mail; the password is PASSWORD. */
export async function makeUser(role: Role, overrides: Partial<{ active: boolean; mustChangePassword: boolean; crewId: number | null }> = {}) {
  counter += 1;
  const email = `${role}.${Date.now()}.${counter}@test.example`;
  return User.create({
    name: `Test ${role} ${counter}`,
    email,
    role,
    crewId: overrides.crewId ?? null,
    passwordHash: await hashPassword(PASSWORD),
    active: overrides.active ?? true,
    mustChangePassword: overrides.mustChangePassword ?? false,
  });
}

export async function makeCrew() {
  counter += 1;
  const [station] = await Station.findOrCreate({ where: { code: 'TST' }, defaults: { code: 'TST', name: 'Test station' } });
  return Crew.create({ stationId: station.id, name: `T${Date.now() % 100000}-${counter}` });
}

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

/** An agent that holds a session cookie and the matching CSRF token. */
export async function anonymousAgent(built: BuiltApp): Promise<Agent> {
  const agent = request.agent(built.app) as Agent;
  const response = await agent.get('/api/session/csrf').expect(200);
  agent.csrf = response.body.csrfToken;
  return agent;
}

export async function signedInAgent(built: BuiltApp, email: string, password = PASSWORD): Promise<Agent> {
  const agent = await anonymousAgent(built);
  const response = await agent.post('/api/session').set('X-CSRF-Token', agent.csrf).send({ email, password });
  if (response.status !== 200) throw new Error(`sign-in failed: ${response.status} ${JSON.stringify(response.body)}`);
  agent.csrf = response.body.csrfToken;
  return agent;
}

export { handBuiltDesign };

/** A unit with design data and the starting limits in force since 2000. */
/**
 * Units made here take the widest plausible ranges unless a test asks otherwise: most tests send
 * rounds chosen for what they check, not to agree with the hand-built design. 'starting': no ranges
 * of the unit's own, so the starting ranges apply, as for a new unit.
 */
type PlausibleOption = PlausibleRanges | 'starting';
async function givePlausibleRanges(unitId: number, effectiveFrom: Date, plausible: PlausibleOption = widestPlausibleRanges) {
  if (plausible !== 'starting') await PlausibleRangeVersion.create({ unitId, effectiveFrom, ranges: plausible, note: 'test ranges', createdBy: null });
}

export async function makeUnit(options: { limits?: LimitSet; plausible?: PlausibleOption } = {}) {
  counter += 1;
  const [station] = await Station.findOrCreate({ where: { code: 'TST' }, defaults: { code: 'TST', name: 'Test station' } });
  const unit = await PlantUnit.create({ stationId: station.id, code: `T${Date.now() % 1_000_000}${counter}`, name: `Test unit ${counter}` });
  const since = new Date('2000-01-01T00:00:00Z');
  await UnitDesignVersion.create({ unitId: unit.id, effectiveFrom: since, data: handBuiltDesign, note: 'test design', createdBy: null });
  await LimitSetVersion.create({ unitId: unit.id, effectiveFrom: since, limits: options.limits ?? startingLimits, note: 'test limits', createdBy: null });
  await givePlausibleRanges(unit.id, since, options.plausible);
  return unit;
}

/** A station of its own (default settings) with one unit and `crews` crews, for tests that set rotations. */
export async function makeStation(crews = 2, options: { plausible?: PlausibleOption } = {}) {
  counter += 1;
  const station = await Station.create({ code: `S${Date.now() % 100_000}${counter}`.slice(0, 16), name: `Test station ${counter}` });
  const unit = await PlantUnit.create({ stationId: station.id, code: 'U1', name: `Unit of station ${counter}` });
  const since = new Date('2000-01-01T00:00:00Z');
  await UnitDesignVersion.create({ unitId: unit.id, effectiveFrom: since, data: handBuiltDesign, note: 'test design', createdBy: null });
  await LimitSetVersion.create({ unitId: unit.id, effectiveFrom: since, limits: startingLimits, note: 'test limits', createdBy: null });
  await givePlausibleRanges(unit.id, since, options.plausible);
  const crewRows = [];
  for (let i = 0; i < crews; i++) crewRows.push(await Crew.create({ stationId: station.id, name: String.fromCharCode(65 + i) }));
  return { station, unit, crews: crewRows };
}

/**
 * Notices other files queued and nobody sent (their apps run no sender) are marked sent, so a file
 * that tests the outbox sees only its own. Test set-up only: it writes the shared test database.
 */
export async function clearOutbox() {
  await db().query('UPDATE outbox SET sent_at = NOW(3), claim_token = NULL, claimed_until = NULL WHERE sent_at IS NULL');
}

/**
 * The app listening on a free port with its Socket.IO server attached, for tests that open real
 * sockets; `close` ends the server (disconnect the test's sockets first).
 */
export async function listenWithSockets(built: BuiltApp): Promise<{ base: string; close: () => Promise<void> }> {
  const server = http.createServer(built.app);
  built.realtime.attach(server, built.sessionMiddleware);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    base: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
