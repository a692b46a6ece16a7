import type { QueryInterface } from 'sequelize';

// Trend reads want (time, value, status) for one unit and parameter: an index that holds all of
// them answers from the index alone, without a lookup per row.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('reading_values', ['unit_id', 'parameter', 'taken_at', 'value', 'status'], { name: 'reading_values_trend_covering' });
  await qi.removeIndex('reading_values', 'reading_values_trend');
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.addIndex('reading_values', ['unit_id', 'parameter', 'taken_at'], { name: 'reading_values_trend' });
  await qi.removeIndex('reading_values', 'reading_values_trend_covering');
}
