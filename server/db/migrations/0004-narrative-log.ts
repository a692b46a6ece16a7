import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const bigId = { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false, type = DataTypes.INTEGER.UNSIGNED) => ({
  type,
  allowNull,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete: 'RESTRICT',
});
const when = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

// The narrative log is append-only: entries, amendments, reviews and acknowledgements are only
// ever inserted. Conditions are closed by a closing entry, never deleted.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('station_settings', {
    station_id: { ...ref('stations'), primaryKey: true },
    time_zone: { type: DataTypes.STRING(64), allowNull: false },
    late_entry_minutes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    shift_change_times: { type: DataTypes.JSON, allowNull: false },
    positions: { type: DataTypes.JSON, allowNull: false },
    categories: { type: DataTypes.JSON, allowNull: false },
    templates: { type: DataTypes.JSON, allowNull: false },
    updated_at: when(),
  });
  await qi.addColumn('users', 'position', { type: DataTypes.STRING(40), allowNull: true });

  await qi.createTable('log_entries', {
    id: bigId,
    unit_id: ref('units'),
    position: { type: DataTypes.STRING(40), allowNull: false },
    category: { type: DataTypes.STRING(40), allowNull: false },
    event_at: when(),
    entered_at: when(),
    shift_start: when(),
    late: { type: DataTypes.BOOLEAN, allowNull: false },
    author_id: ref('users'),
    text: { type: DataTypes.TEXT, allowNull: false },
    equipment_id: ref('equipment', true),
    reading_set_id: ref('reading_sets', true, DataTypes.BIGINT.UNSIGNED),
    flag_id: ref('flags', true),
    condition_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    carry_to_handover: { type: DataTypes.BOOLEAN, allowNull: false },
  });
  await qi.addIndex('log_entries', ['unit_id', 'event_at']);
  await qi.addIndex('log_entries', ['unit_id', 'shift_start', 'position']);
  await qi.createTable('log_amendments', {
    id: bigId,
    entry_id: ref('log_entries', false, DataTypes.BIGINT.UNSIGNED),
    author_id: ref('users'),
    amended_at: when(),
    reason: { type: DataTypes.STRING(1000), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
  });
  await qi.addIndex('log_amendments', ['entry_id']);
  await qi.createTable('log_reviews', {
    id,
    unit_id: ref('units'),
    position: { type: DataTypes.STRING(40), allowNull: false },
    shift_start: when(),
    reviewed_by: ref('users'),
    reviewed_at: when(),
  });
  await qi.addIndex('log_reviews', ['unit_id', 'position', 'shift_start'], { unique: true });

  await qi.createTable('standing_orders', {
    id,
    station_id: ref('stations'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    body_html: { type: DataTypes.TEXT, allowNull: false },
    body_text: { type: DataTypes.TEXT, allowNull: false },
    effective_from: when(),
    effective_to: when(true),
    crew_ids: { type: DataTypes.JSON, allowNull: false },
    positions: { type: DataTypes.JSON, allowNull: false },
    issued_by: ref('users'),
    issued_at: when(),
  });
  await qi.addIndex('standing_orders', ['station_id', 'effective_from']);
  await qi.createTable('standing_order_acks', {
    order_id: { ...ref('standing_orders'), primaryKey: true },
    user_id: { ...ref('users'), primaryKey: true },
    acknowledged_at: when(),
  });

  await qi.createTable('conditions', {
    id,
    unit_id: ref('units'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    required_action: { type: DataTypes.STRING(2000), allowNull: false },
    started_at: when(),
    limit_at: when(),
    owner_id: ref('users'),
    opened_by: ref('users'),
    opened_at: when(),
    closed_by: ref('users', true),
    closed_at: when(true),
    closing_entry_id: ref('log_entries', true, DataTypes.BIGINT.UNSIGNED),
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
  await qi.addIndex('conditions', ['unit_id', 'closed_at']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['conditions', 'standing_order_acks', 'standing_orders', 'log_reviews', 'log_amendments', 'log_entries', 'station_settings']) {
    await qi.dropTable(table);
  }
  await qi.removeColumn('users', 'position');
}
