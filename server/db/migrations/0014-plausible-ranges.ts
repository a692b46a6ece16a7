import { DataTypes, type QueryInterface } from 'sequelize';

const when = { type: DataTypes.DATE(3), allowNull: false };
const ref = (table: string, allowNull: boolean) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete: 'RESTRICT',
});

// Plausible ranges per unit, versioned like the limits: a reading is asked about, marked and has its
// derived checks withheld by the ranges in force when it was taken. A unit with no version yet uses
// the starting ranges (common practice), so nothing is inserted here.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('plausible_range_versions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    unit_id: ref('units', false),
    effective_from: when,
    ranges: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: true },
    created_by: ref('users', true),
    created_at: when,
  });
  await qi.addIndex('plausible_range_versions', ['unit_id', 'effective_from']);

  // The keys of the readings and checks a round (or its amendment) holds outside the plausible range;
  // an empty list when none. Null on the reading: judged by the starting ranges.
  await qi.addColumn('reading_sets', 'outside_plausible', { type: DataTypes.JSON, allowNull: false, defaultValue: '[]' });
  await qi.addColumn('reading_sets', 'plausible_version_id', ref('plausible_range_versions', true));
  await qi.addColumn('reading_amendments', 'outside_plausible', { type: DataTypes.JSON, allowNull: false, defaultValue: '[]' });

  // Trends leave marked points out of the axis: the flag joins the covering index the trend reads.
  await qi.addColumn('reading_values', 'outside_plausible', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addIndex('reading_values', ['unit_id', 'parameter', 'taken_at', 'value', 'status', 'outside_plausible'], { name: 'reading_values_trend_marked' });
  await qi.removeIndex('reading_values', 'reading_values_trend_covering');
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('reading_values', ['unit_id', 'parameter', 'taken_at', 'value', 'status'], { name: 'reading_values_trend_covering' });
  await qi.removeIndex('reading_values', 'reading_values_trend_marked');
  await qi.removeColumn('reading_values', 'outside_plausible');
  await qi.removeColumn('reading_amendments', 'outside_plausible');
  await qi.removeColumn('reading_sets', 'plausible_version_id');
  await qi.removeColumn('reading_sets', 'outside_plausible');
  await qi.dropTable('plausible_range_versions');
}
