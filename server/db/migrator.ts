import { Umzug, SequelizeStorage } from 'umzug';
import type { Sequelize } from 'sequelize';
import * as foundation from './migrations/0001-foundation';
import * as condenserDesign from './migrations/0002-condenser-design';
import * as roundsAndFlags from './migrations/0003-rounds-and-flags';
import * as narrativeLog from './migrations/0004-narrative-log';
import * as handovers from './migrations/0005-handovers';
import * as notices from './migrations/0006-notices';
import * as attachments from './migrations/0007-attachments';
import * as trendIndex from './migrations/0008-trend-index';
import * as trainingAndLogbook from './migrations/0009-training-and-logbook';
import * as handoverIntegrity from './migrations/0010-handover-integrity';
import * as handoverCondenserSnapshot from './migrations/0011-handover-condenser-snapshot';
import * as roundIntervalAndHandoverWindow from './migrations/0012-round-interval-and-handover-window';
import * as accessAndSignIn from './migrations/0013-access-and-sign-in';
import * as plausibleRanges from './migrations/0014-plausible-ranges';
import * as outbox from './migrations/0015-outbox';
import * as offlineRecords from './migrations/0016-offline-records';

// Listed explicitly so the order is obvious and nothing depends on globbing at run time.
const migrations = [
  { name: '0001-foundation', ...foundation },
  { name: '0002-condenser-design', ...condenserDesign },
  { name: '0003-rounds-and-flags', ...roundsAndFlags },
  { name: '0004-narrative-log', ...narrativeLog },
  { name: '0005-handovers', ...handovers },
  { name: '0006-notices', ...notices },
  { name: '0007-attachments', ...attachments },
  { name: '0008-trend-index', ...trendIndex },
  { name: '0009-training-and-logbook', ...trainingAndLogbook },
  { name: '0010-handover-integrity', ...handoverIntegrity },
  { name: '0011-handover-condenser-snapshot', ...handoverCondenserSnapshot },
  { name: '0012-round-interval-and-handover-window', ...roundIntervalAndHandoverWindow },
  { name: '0013-access-and-sign-in', ...accessAndSignIn },
  { name: '0014-plausible-ranges', ...plausibleRanges },
  { name: '0015-outbox', ...outbox },
  { name: '0016-offline-records', ...offlineRecords },
];

/** Every migration this code expects, in order (the readiness probe compares the database with it). */
export const migrationNames: readonly string[] = migrations.map((m) => m.name);

export function createMigrator(sequelize: Sequelize) {
  const qi = sequelize.getQueryInterface();
  return new Umzug({
    migrations: migrations.map((m) => ({ name: m.name, up: () => m.up({ context: qi }), down: () => m.down({ context: qi }) })),
    context: qi,
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}
