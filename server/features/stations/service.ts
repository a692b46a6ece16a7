// Station settings: only administrators change them, and every change is in the audit trail with
// the settings before and after.
import type { Sequelize } from 'sequelize';
import type { StationSettings } from '../../../shared/schemas/log';
import { recordAudit } from '../../lib/audit';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { NotFound } from '../../lib/errors';
import { findStation } from '../plant/index';
import { StationSettingsRow } from './model';
import { settingsForStation } from './settings';

export async function requireStation(stationId: number) {
  const station = await findStation(stationId);
  if (!station) throw new NotFound('That station');
  return station;
}

/** A station's settings (the defaults where it has none of its own); 404 for an unknown station. */
export async function stationSettings(stationId: number) {
  await requireStation(stationId);
  return settingsForStation(stationId);
}

export function makeStationService(sequelize: Sequelize) {
  async function saveSettings(actor: Express.User, stationId: number, settings: StationSettings): Promise<StationSettings> {
    await requireStation(stationId);
    await unitOfWork(sequelize, async (transaction) => {
      const before = await settingsForStation(stationId, transaction);
      await StationSettingsRow.upsert({ stationId, ...settings, updatedAt: new Date() }, { transaction });
      await recordAudit({ actorId: actor.id, action: 'station.settings', entity: 'station', entityId: stationId, before, after: settings }, transaction);
      publish(transaction, { entity: 'station_settings', id: stationId });
    });
    return settings;
  }

  return { saveSettings };
}
export type StationService = ReturnType<typeof makeStationService>;
