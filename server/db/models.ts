import type { Sequelize } from 'sequelize';
import { User } from '../features/users/model';
import { SessionRow } from '../features/session/model';
import { AuditEvent } from '../features/audit/model';
import { initPlantModels } from '../features/plant/model';
import { initReadingModels } from '../features/readings/model';
import { initFlagModel } from '../features/flags/model';
import { initImportModel } from '../features/imports/model';
import { initStationModels } from '../features/stations/model';
import { initLogModels } from '../features/log/model';
import { initStandingOrderModels } from '../features/standing-orders/model';
import { initConditionModel } from '../features/conditions/model';
import { initHandoverModels } from '../features/handovers/model';
import { initAttachmentModel } from '../features/attachments/model';
import { initShiftModels } from '../features/shifts/model';
import { initTrainingModels } from '../features/training/model';
import { initLogbookModels } from '../features/logbook/model';
import { registerLogbookIndexHooks } from '../features/logbook/index-hooks';
import { registerHandoverDraftHooks } from '../features/handovers/draft-hooks';
import { watchReferenceModels } from '../lib/reference-cache';
import { Crew, LimitSetVersion, PlantUnit, PlausibleRangeVersion, Station, UnitDesignVersion } from '../features/plant/model';
import { StationSettingsRow } from '../features/stations/model';
import { CrewSwap } from '../features/shifts/model';

/** Registers every model on the instance. Schema comes from migrations, never from sync(). */
export function initModels(sequelize: Sequelize) {
  User.initModel(sequelize);
  SessionRow.initModel(sequelize);
  AuditEvent.initModel(sequelize);
  initPlantModels(sequelize);
  initReadingModels(sequelize);
  initFlagModel(sequelize);
  initImportModel(sequelize);
  initStationModels(sequelize);
  initLogModels(sequelize);
  initStandingOrderModels(sequelize);
  initConditionModel(sequelize);
  initHandoverModels(sequelize);
  initAttachmentModel(sequelize);
  initShiftModels(sequelize);
  initTrainingModels(sequelize);
  initLogbookModels(sequelize);
  registerLogbookIndexHooks(sequelize);
  registerHandoverDraftHooks();
  // Reference data is cached (lib/reference-cache.ts); a write to any of these forgets it.
  // Users too: people's names, roles and crews (users/people.ts's directory).
  watchReferenceModels([Station, PlantUnit, Crew, UnitDesignVersion, LimitSetVersion, PlausibleRangeVersion, StationSettingsRow, CrewSwap, User]);
}
