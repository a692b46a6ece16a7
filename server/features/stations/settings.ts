import type { Transaction } from 'sequelize';
import type { StationSettings } from '../../../shared/schemas/log';
import { findUnit } from '../plant/index';
import { NotFound, ValidationError } from '../../lib/errors';
import { referenceRead } from '../../lib/reference-cache';
import { StationSettingsRow } from './model';

/** What a station without its own settings starts from. */
export const defaultStationSettings: StationSettings = {
  timeZone: 'Europe/Berlin',
  lateEntryMinutes: 30,
  shiftChangeTimes: ['06:00', '18:00'],
  // Common practice varies from hourly rounds to one a shift; four hours is a starting point only.
  roundIntervalMinutes: 240,
  handoverWindowBeforeMinutes: 120,
  handoverWindowAfterMinutes: 120,
  positions: [
    { key: 'control_room', label: 'Control room' },
    { key: 'field_cw_tower', label: 'Field — CW and tower' },
    { key: 'chemistry', label: 'Chemistry' },
  ],
  categories: [
    { key: 'equipment_status', label: 'Equipment status change' },
    { key: 'operation', label: 'Operation' },
    { key: 'alarm_abnormal', label: 'Alarm or abnormal condition' },
    { key: 'test', label: 'Test' },
    { key: 'chemistry', label: 'Chemistry' },
    { key: 'communication', label: 'Communication' },
    { key: 'other', label: 'Other' },
  ],
  templates: [
    { label: 'Started CW pump', category: 'equipment_status', text: 'Started {equipment}; discharge pressure normal, no abnormal noise.' },
    { label: 'Stopped CW pump', category: 'equipment_status', text: 'Stopped {equipment}.' },
    { label: 'Waterbox backwash', category: 'operation', text: 'Backwashed waterbox on {equipment}; ΔP before / after recorded on the round.' },
    { label: 'Vacuum-decay test', category: 'test', text: 'Vacuum-decay test on {equipment} with air removal isolated; rate recorded on the round.' },
  ],
};

export async function settingsForStation(stationId: number, transaction?: Transaction): Promise<StationSettings> {
  return (await stationShiftSetup(stationId, transaction)).settings;
}

/** A station's settings and its crew rotation (null without one), from one read of its row. */
export async function stationShiftSetup(stationId: number, transaction?: Transaction | null) {
  return referenceRead(
    `station-setup:${stationId}`,
    async () => {
      const row = await StationSettingsRow.findByPk(stationId, { transaction: transaction ?? undefined });
      return { settings: row ? settingsFromRow(row) : defaultStationSettings, rotation: row?.crewRotation ?? null };
    },
    transaction,
  );
}

/** Every station's settings and rotation, by station id (stations without a row are absent: they use the defaults). */
export async function shiftSetupsByStation() {
  return referenceRead('station-setups', async () => {
    const rows = await StationSettingsRow.findAll();
    return new Map(rows.map((r) => [r.stationId, { settings: settingsFromRow(r), rotation: r.crewRotation ?? null }]));
  });
}

/** Every station's time zone, by station id (stations without settings are absent: they use the default zone). */
export async function timeZonesByStation() {
  return new Map([...(await shiftSetupsByStation())].map(([stationId, setup]) => [stationId, setup.settings.timeZone]));
}

/** Sets a station's crew rotation in the caller's unit of work (a station without settings gets the defaults with it). */
export async function saveCrewRotation(stationId: number, rotation: { anchorShiftStart: string; crewIds: number[] }, transaction: Transaction) {
  const row = await StationSettingsRow.findByPk(stationId, { transaction, lock: transaction.LOCK.UPDATE });
  if (row) await row.update({ crewRotation: rotation }, { transaction });
  else await StationSettingsRow.create({ stationId, ...defaultStationSettings, crewRotation: rotation, updatedAt: new Date() }, { transaction });
}

export function settingsFromRow(row: StationSettingsRow): StationSettings {
  return {
    timeZone: row.timeZone,
    lateEntryMinutes: row.lateEntryMinutes,
    shiftChangeTimes: row.shiftChangeTimes,
    roundIntervalMinutes: row.roundIntervalMinutes,
    handoverWindowBeforeMinutes: row.handoverWindowBeforeMinutes,
    handoverWindowAfterMinutes: row.handoverWindowAfterMinutes,
    positions: row.positions,
    categories: row.categories,
    templates: row.templates,
  };
}

export async function settingsForUnit(unitId: number) {
  const unit = await findUnit(unitId);
  if (!unit) throw new NotFound('That unit');
  return { unit, settings: await settingsForStation(unit.stationId) };
}

export function requireKnown(settings: StationSettings, input: { position?: string; category?: string }) {
  const fields: Record<string, string> = {};
  if (input.position !== undefined && !settings.positions.some((p) => p.key === input.position)) fields.position = 'Not a position of this station';
  if (input.category !== undefined && !settings.categories.some((c) => c.key === input.category)) fields.category = 'Not a log category of this station';
  if (Object.keys(fields).length) throw new ValidationError(fields);
}
