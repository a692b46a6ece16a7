// Reference data (stations' settings, units, crews, swaps, versions) is cached in the process and
// forgotten when it changes through the app. A change made behind the app's back (raw SQL here) is
// what shows the cache is really used; a change through the models must be seen at once after commit.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { settingsForStation, defaultStationSettings } from '../../server/features/stations/index';
import { StationSettingsRow } from '../../server/features/stations/model';
import { limitsInForce } from '../../server/features/plant/index';
import { LimitSetVersion } from '../../server/features/plant/model';
import { unitOfWork } from '../../server/lib/unit-of-work';
import { startingLimits } from '../../shared/calc/limits';
import { namesOf } from '../../server/features/users/index';
import { User } from '../../server/features/users/model';
import { closeAll, db, makeStation, makeUser } from './support/test-app';

let stationId = 0;
let unitId = 0;

beforeAll(async () => {
  db(); // registers the models
  const { station, unit } = await makeStation(2);
  stationId = station.id;
  unitId = unit.id;
  await StationSettingsRow.create({ stationId, ...defaultStationSettings, lateEntryMinutes: 30, crewRotation: null, updatedAt: new Date() });
});
afterAll(closeAll);

const lateMinutesInDatabase = async () =>
  (await db().query<{ m: number }>('SELECT late_entry_minutes AS m FROM station_settings WHERE station_id = ?', { replacements: [stationId], type: QueryTypes.SELECT }))[0]!.m;

describe('reference data cache', () => {
  it('answers from memory: a change behind the app’s back is not seen', async () => {
    expect((await settingsForStation(stationId)).lateEntryMinutes).toBe(30);
    await db().query('UPDATE station_settings SET late_entry_minutes = 77 WHERE station_id = ?', { replacements: [stationId] });
    expect(await lateMinutesInDatabase()).toBe(77);
    expect((await settingsForStation(stationId)).lateEntryMinutes).toBe(30);
  });

  it('sees a change through the app as soon as it commits, and the transaction that made it sees its own change', async () => {
    await settingsForStation(stationId);
    await unitOfWork(db(), async (transaction) => {
      await StationSettingsRow.update({ lateEntryMinutes: 45 }, { where: { stationId }, transaction });
      expect((await settingsForStation(stationId, transaction)).lateEntryMinutes).toBe(45);
    });
    expect((await settingsForStation(stationId)).lateEntryMinutes).toBe(45);
  });

  it('a change rolled back leaves the committed value', async () => {
    await expect(
      unitOfWork(db(), async (transaction) => {
        await StationSettingsRow.update({ lateEntryMinutes: 5 }, { where: { stationId }, transaction });
        throw new Error('changed my mind');
      }),
    ).rejects.toThrow('changed my mind');
    expect((await settingsForStation(stationId)).lateEntryMinutes).toBe(45);
  });

  it('a new limit set is in force for the next reading at once', async () => {
    const before = await limitsInForce(unitId);
    const created = await LimitSetVersion.create({ unitId, effectiveFrom: new Date(), limits: startingLimits, note: 'tightened', createdBy: null });
    const now = await limitsInForce(unitId);
    expect(now.id).toBe(created.id);
    expect(now.id).not.toBe(before.id);
    // A moment before it still has the earlier set.
    expect((await limitsInForce(unitId, new Date(created.effectiveFrom.getTime() - 1))).id).toBe(before.id);
  });

  it('people’s names come from memory, and a rename through the app is seen at once', async () => {
    const person = await makeUser('operator');
    expect((await namesOf([person.id])).get(person.id)).toBe(person.name);
    await db().query('UPDATE users SET name = ? WHERE id = ?', { replacements: ['Renamed behind the app', person.id] });
    expect((await namesOf([person.id])).get(person.id)).toBe(person.name);
    await User.update({ name: 'Renamed by an administrator' }, { where: { id: person.id } });
    expect((await namesOf([person.id])).get(person.id)).toBe('Renamed by an administrator');
  });
});
