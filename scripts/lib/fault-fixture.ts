// The fault test's world: one station with a unit that takes rounds, log entries and handover items,
// and a row of units whose handovers are submitted during the run (each submit writes a notice);
// people signed in over HTTP with a client that never waits longer than a few seconds.
import { shortestShiftMinutes } from '../../shared/schemas/log';
import { startingLimits } from '../../shared/calc/limits';
import { demoCondenserDesign } from '../../server/db/seed/demo-plant';
import { hashPassword } from '../../server/lib/auth';
import { Crew, LimitSetVersion, PlantUnit, PlausibleRangeVersion, Station, UnitDesignVersion } from '../../server/features/plant/model';
import { plausibleCatalog, plausibleKeys, type PlausibleRanges } from '../../shared/calc/plausibility';

const widestRanges = Object.fromEntries(plausibleKeys.map((key) => [key, plausibleCatalog[key].settable])) as PlausibleRanges;
import { User } from '../../server/features/users/model';

const PASSWORD = 'fault-test pass phrase 7';

export type Client = {
  /** Answers the status (0 when the request failed or timed out) and the JSON body. */
  call(method: string, path: string, body?: unknown): Promise<{ status: number; body: Record<string, unknown> }>;
};

export async function signIn(base: string, email: string): Promise<Client> {
  let cookie = '';
  let csrf = '';
  const call: Client['call'] = async (method, path, body) => {
    try {
      const response = await fetch(base + path, {
        method,
        headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrf },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(8_000),
      });
      const setCookie = response.headers.get('set-cookie');
      if (setCookie) cookie = setCookie.split(';')[0]!;
      const text = await response.text();
      return { status: response.status, body: text ? (JSON.parse(text) as Record<string, unknown>) : {} };
    } catch {
      return { status: 0, body: {} };
    }
  };
  csrf = String((await call('GET', '/api/session/csrf')).body.csrfToken);
  const signedIn = await call('POST', '/api/session', { email, password: PASSWORD });
  if (signedIn.status !== 200) throw new Error(`sign-in of ${email} failed: ${signedIn.status} ${JSON.stringify(signedIn.body)}`);
  csrf = String(signedIn.body.csrfToken);
  return { call };
}

export type World = { unitId: number; submitUnitIds: number[]; stationId: number; people: { admin: string; operators: string[]; incoming: string[] } };

/** Station, units with design data and limits, two crews and their people. */
export async function buildWorld(submitUnits: number): Promise<World> {
  const station = await Station.create({ code: 'FLT', name: 'Fernhollow fault drill' });
  const since = new Date('2020-01-01T00:00:00Z');
  const unit = async (code: string) => {
    const u = await PlantUnit.create({ stationId: station.id, code, name: `Drill unit ${code}` });
    await UnitDesignVersion.create({ unitId: u.id, effectiveFrom: since, data: demoCondenserDesign, note: 'fault drill', createdBy: null });
    await LimitSetVersion.create({ unitId: u.id, effectiveFrom: since, limits: startingLimits, note: 'fault drill', createdBy: null });
    // The drill's rounds are about faults, not plausibility: nothing they carry is to be refused as odd.
    await PlausibleRangeVersion.create({ unitId: u.id, effectiveFrom: since, ranges: widestRanges, note: 'fault drill', createdBy: null });
    return u.id;
  };
  const unitId = await unit('D1');
  const submitUnitIds: number[] = [];
  for (let i = 0; i < submitUnits; i++) submitUnitIds.push(await unit(`S${i + 1}`));
  const [a, b] = [await Crew.create({ stationId: station.id, name: 'A' }), await Crew.create({ stationId: station.id, name: 'B' })];
  const passwordHash = await hashPassword(PASSWORD);
  const person = async (role: 'admin' | 'operator' | 'shift_lead', crewId: number | null, n: string) =>
    (await User.create({ name: `Drill ${role} ${n}`, email: `${role}.${n}@drill.example`, role, crewId, passwordHash, active: true, mustChangePassword: false })).email;
  const admin = await person('admin', null, '0');
  const operators = [await person('operator', a.id, '1'), await person('operator', a.id, '2'), await person('shift_lead', a.id, '3')];
  const incoming = [await person('shift_lead', b.id, '4'), await person('operator', b.id, '5')];
  return { unitId, submitUnitIds, stationId: station.id, people: { admin, operators, incoming } };
}

/** Crew A on the shift in progress; the handover window covers the whole shift, so a submit is always in time. */
export async function arrangeShifts(admin: Client, world: World) {
  const shifts = await admin.call('GET', `/api/units/${world.unitId}/log/shifts`);
  const crews = (await Crew.findAll({ where: { stationId: world.stationId }, order: [['name', 'ASC']] })).map((c) => c.id);
  const rotation = await admin.call('PUT', `/api/stations/${world.stationId}/crew-rotation`, { anchorShiftStart: (shifts.body.shifts as { start: string }[])[0]!.start, crewIds: crews });
  if (rotation.status !== 200) throw new Error(`crew rotation: ${rotation.status} ${JSON.stringify(rotation.body)}`);
  const { settings } = (await admin.call('GET', `/api/stations/${world.stationId}/settings`)).body as { settings: Record<string, unknown> & { shiftChangeTimes: string[]; positions: { key: string }[]; categories: { key: string }[] } };
  const shortest = shortestShiftMinutes(settings.shiftChangeTimes);
  const saved = await admin.call('PUT', `/api/stations/${world.stationId}/settings`, { ...settings, handoverWindowBeforeMinutes: shortest, handoverWindowAfterMinutes: 0 });
  if (saved.status !== 200) throw new Error(`station settings: ${saved.status} ${JSON.stringify(saved.body)}`);
  return settings;
}
