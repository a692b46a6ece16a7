import { DataTypes, literal, type QueryInterface } from 'sequelize';

// Rounds and log entries made on a device without a network arrive later. Each carries the device's
// client id (a retry returns the record already stored instead of making a second), the time it was
// entered on the device and the time it arrived, and whether it arrived late (more than the
// station's late-entry minutes after it was entered). Existing rows were entered as they arrived.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('reading_sets', 'client_id', { type: DataTypes.CHAR(36), allowNull: true });
  // Not null with a default from the start: nodes still running the previous version (the migration
  // runs while they serve) insert without these columns, and a row they write meanwhile must not
  // stop the migration half-way.
  await qi.addColumn('reading_sets', 'entered_at', { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') });
  await qi.addColumn('reading_sets', 'arrived_late', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.sequelize.query('UPDATE reading_sets SET entered_at = recorded_at');
  // One record per author and client id; NULLs (records from elsewhere) never collide.
  await qi.addIndex('reading_sets', ['recorded_by', 'client_id'], { unique: true, name: 'reading_sets_client_once' });

  await qi.addColumn('log_entries', 'client_id', { type: DataTypes.CHAR(36), allowNull: true });
  await qi.addColumn('log_entries', 'received_at', { type: DataTypes.DATE(3), allowNull: false, defaultValue: literal('CURRENT_TIMESTAMP(3)') });
  await qi.addColumn('log_entries', 'arrived_late', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.sequelize.query('UPDATE log_entries SET received_at = entered_at');
  await qi.addIndex('log_entries', ['author_id', 'client_id'], { unique: true, name: 'log_entries_client_once' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('log_entries', 'log_entries_client_once');
  for (const column of ['arrived_late', 'received_at', 'client_id']) await qi.removeColumn('log_entries', column);
  await qi.removeIndex('reading_sets', 'reading_sets_client_once');
  for (const column of ['arrived_late', 'entered_at', 'client_id']) await qi.removeColumn('reading_sets', column);
}
