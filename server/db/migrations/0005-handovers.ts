import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const ref = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete: 'RESTRICT',
});
const when = (allowNull = false) => ({ type: DataTypes.DATE(3), allowNull });

// Shift handover: a crew rotation per station with one-off swaps, and per unit and shift change a
// handover with notes, items, acknowledgements, queries and amendments. Records are only inserted;
// the handover row itself moves draft → submitted → accepted and is then read-only.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('station_settings', 'crew_rotation', { type: DataTypes.JSON, allowNull: true });
  await qi.createTable('crew_swaps', {
    id,
    station_id: ref('stations'),
    shift_start: when(),
    crew_id: ref('crews'),
    reason: { type: DataTypes.STRING(500), allowNull: false },
    created_by: ref('users'),
    created_at: when(),
  });
  await qi.addIndex('crew_swaps', ['station_id', 'shift_start'], { unique: true });
  await qi.createTable('handovers', {
    id,
    unit_id: ref('units'),
    shift_start: when(),
    handover_at: when(),
    outgoing_crew_id: ref('crews', true),
    incoming_crew_id: ref('crews', true),
    notes_html: { type: DataTypes.TEXT('medium'), allowNull: false },
    notes_version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    status: { type: DataTypes.ENUM('draft', 'submitted', 'accepted'), allowNull: false },
    created_by: ref('users'),
    created_at: when(),
    submitted_by: ref('users', true),
    submitted_at: when(true),
    accepted_by: ref('users', true),
    accepted_at: when(true),
  });
  await qi.addIndex('handovers', ['unit_id', 'shift_start'], { unique: true });
  await qi.createTable('handover_items', {
    id,
    handover_id: ref('handovers'),
    kind: { type: DataTypes.STRING(30), allowNull: false },
    title: { type: DataTypes.STRING(300), allowNull: false },
    detail: { type: DataTypes.TEXT, allowNull: true },
    reference: { type: DataTypes.STRING(80), allowNull: true },
    priority: { type: DataTypes.ENUM('low', 'normal', 'high'), allowNull: false },
    source_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true },
    created_by: ref('users'),
    created_at: when(),
  });
  await qi.addIndex('handover_items', ['handover_id', 'kind', 'source_id']);
  await qi.createTable('handover_acks', {
    item_id: { ...ref('handover_items'), primaryKey: true },
    user_id: { ...ref('users'), primaryKey: true },
    acknowledged_at: when(),
  });
  await qi.createTable('handover_queries', {
    id,
    item_id: ref('handover_items'),
    asked_by: ref('users'),
    asked_at: when(),
    question: { type: DataTypes.STRING(2000), allowNull: false },
    answered_by: ref('users', true),
    answered_at: when(true),
    answer: { type: DataTypes.STRING(2000), allowNull: true },
  });
  await qi.createTable('handover_amendments', {
    id,
    handover_id: ref('handovers'),
    item_id: ref('handover_items', true),
    author_id: ref('users'),
    amended_at: when(),
    reason: { type: DataTypes.STRING(1000), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['handover_amendments', 'handover_queries', 'handover_acks', 'handover_items', 'handovers', 'crew_swaps']) {
    await qi.dropTable(table);
  }
  await qi.removeColumn('station_settings', 'crew_rotation');
}
