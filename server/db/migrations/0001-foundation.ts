import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true };
const timestamps = {
  created_at: { type: DataTypes.DATE(3), allowNull: false },
  updated_at: { type: DataTypes.DATE(3), allowNull: false },
};
const fk = (table: string, allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onUpdate: 'CASCADE',
  onDelete: 'RESTRICT',
});

export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('stations', {
    id,
    code: { type: DataTypes.STRING(16), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    ...timestamps,
  });
  await qi.createTable('units', {
    id,
    station_id: fk('stations'),
    code: { type: DataTypes.STRING(16), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('units', ['station_id', 'code'], { unique: true });
  await qi.createTable('equipment', {
    id,
    unit_id: fk('units'),
    kind: { type: DataTypes.ENUM('condenser', 'cw_pump', 'cooling_tower', 'air_removal', 'other'), allowNull: false },
    tag: { type: DataTypes.STRING(32), allowNull: false },
    name: { type: DataTypes.STRING(120), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('equipment', ['unit_id', 'tag'], { unique: true });
  await qi.createTable('crews', {
    id,
    station_id: fk('stations'),
    name: { type: DataTypes.STRING(40), allowNull: false },
    ...timestamps,
  });
  await qi.addIndex('crews', ['station_id', 'name'], { unique: true });
  await qi.createTable('users', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    role: { type: DataTypes.ENUM('trainee', 'operator', 'shift_lead', 'trainer', 'admin'), allowNull: false },
    crew_id: fk('crews', true),
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    password_hash: { type: DataTypes.STRING(255), allowNull: false },
    must_change_password: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  // Shape expected by connect-session-sequelize, plus user_id so a deactivation can end sessions.
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT, allowNull: true },
    ...timestamps,
  });
  await qi.addIndex('sessions', ['user_id']);
  await qi.addIndex('sessions', ['expires']);
  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    actor_id: fk('users', true),
    action: { type: DataTypes.STRING(64), allowNull: false },
    entity: { type: DataTypes.STRING(64), allowNull: false },
    entity_id: { type: DataTypes.STRING(64), allowNull: true },
    before: { type: DataTypes.JSON, allowNull: true },
    after: { type: DataTypes.JSON, allowNull: true },
    at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('audit_events', ['entity', 'entity_id']);
  await qi.addIndex('audit_events', ['at']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['audit_events', 'sessions', 'users', 'crews', 'equipment', 'units', 'stations']) {
    await qi.dropTable(table);
  }
}
