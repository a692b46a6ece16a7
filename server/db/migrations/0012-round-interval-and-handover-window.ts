import { DataTypes, type QueryInterface } from 'sequelize';

const minutes = (defaultValue: number) => ({ type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue });

// How often a round is due, and the time around a shift change in which a handover may be submitted
// and accepted. Existing stations get the starting values (240 / 120 / 120 minutes) until an
// administrator sets their own.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('station_settings', 'round_interval_minutes', minutes(240));
  await qi.addColumn('station_settings', 'handover_window_before_minutes', minutes(120));
  await qi.addColumn('station_settings', 'handover_window_after_minutes', minutes(120));
  // "Waiting on you" lists trainee rounds still to countersign, newest first: without this index
  // that is a scan of every round ever taken.
  await qi.addIndex('reading_sets', ['recorded_as_trainee', 'taken_at'], { name: 'reading_sets_trainee_taken' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('reading_sets', 'reading_sets_trainee_taken');
  await qi.removeColumn('station_settings', 'handover_window_after_minutes');
  await qi.removeColumn('station_settings', 'handover_window_before_minutes');
  await qi.removeColumn('station_settings', 'round_interval_minutes');
}
