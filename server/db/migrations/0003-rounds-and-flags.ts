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

// Design data and limits become versioned: a reading is judged by the versions in force when it
// was taken. Readings and their amendments are append-only records.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('unit_design_versions', {
    id,
    unit_id: ref('units'),
    effective_from: when(),
    data: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: true },
    created_by: ref('users', true),
    created_at: when(),
  });
  await qi.addIndex('unit_design_versions', ['unit_id', 'effective_from']);
  await qi.createTable('limit_set_versions', {
    id,
    unit_id: ref('units'),
    effective_from: when(),
    limits: { type: DataTypes.JSON, allowNull: false },
    note: { type: DataTypes.STRING(500), allowNull: true },
    created_by: ref('users', true),
    created_at: when(),
  });
  await qi.addIndex('limit_set_versions', ['unit_id', 'effective_from']);

  // Carry the one-row design table over as version 1 of each unit's design.
  await qi.sequelize.query(`
    INSERT INTO unit_design_versions (unit_id, effective_from, data, note, created_by, created_at)
    SELECT unit_id, '2000-01-01 00:00:00', JSON_OBJECT(
      'surfaceAreaM2', surface_area_m2, 'tubeOdMm', tube_od_mm, 'tubeGaugeBwg', tube_gauge_bwg,
      'tubeMaterial', tube_material, 'tubeCount', tube_count, 'passes', passes,
      'designCwFlowKgS', design_cw_flow_kg_s, 'designCwInletK', design_cw_inlet_k,
      'designBackpressurePa', design_backpressure_pa, 'designDutyW', design_duty_w,
      'designCleanliness', design_cleanliness, 'designCleanUWM2K', design_clean_u_w_m2k,
      'backpressureCorrection', JSON_EXTRACT(backpressure_correction, '$'),
      'energyPricePerMwh', energy_price_per_mwh, 'currency', currency
    ), 'carried over from the first design table', NULL, NOW(3)
    FROM condenser_designs`);
  await qi.dropTable('condenser_designs');

  await qi.createTable('reading_sets', {
    id: bigId,
    unit_id: ref('units'),
    taken_at: when(),
    recorded_at: when(),
    recorded_by: ref('users'),
    recorded_as_trainee: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    source: { type: DataTypes.ENUM('round', 'import'), allowNull: false },
    // Unique per unit for imported rows, so the same row imported twice is stored once.
    import_key: { type: DataTypes.STRING(64), allowNull: true },
    design_version_id: ref('unit_design_versions'),
    limit_version_id: ref('limit_set_versions'),
    raw: { type: DataTypes.JSON, allowNull: false },
    si: { type: DataTypes.JSON, allowNull: false },
    results: { type: DataTypes.JSON, allowNull: false },
    worst_status: { type: DataTypes.ENUM('normal', 'watch', 'alarm', 'unknown'), allowNull: false },
  });
  await qi.addIndex('reading_sets', ['unit_id', 'taken_at']);
  await qi.addIndex('reading_sets', ['unit_id', 'import_key'], { unique: true, name: 'reading_sets_import_key' });

  await qi.createTable('reading_amendments', {
    id: bigId,
    reading_set_id: ref('reading_sets', false, DataTypes.BIGINT.UNSIGNED),
    amended_by: ref('users'),
    amended_at: when(),
    reason: { type: DataTypes.STRING(1000), allowNull: false },
    raw: { type: DataTypes.JSON, allowNull: false },
    si: { type: DataTypes.JSON, allowNull: false },
    results: { type: DataTypes.JSON, allowNull: false },
    worst_status: { type: DataTypes.ENUM('normal', 'watch', 'alarm', 'unknown'), allowNull: false },
  });
  await qi.addIndex('reading_amendments', ['reading_set_id']);

  await qi.createTable('reading_countersigns', {
    reading_set_id: { ...ref('reading_sets', false, DataTypes.BIGINT.UNSIGNED), primaryKey: true },
    signed_by: ref('users'),
    signed_at: when(),
  });

  // Derived, one row per computed value of the reading's current version: what trends read.
  await qi.createTable('reading_values', {
    reading_set_id: { ...ref('reading_sets', false, DataTypes.BIGINT.UNSIGNED), primaryKey: true },
    parameter: { type: DataTypes.STRING(40), allowNull: false, primaryKey: true },
    unit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    taken_at: when(),
    value: { type: DataTypes.DOUBLE, allowNull: false },
    status: { type: DataTypes.ENUM('normal', 'watch', 'alarm', 'unknown'), allowNull: false },
  });
  await qi.addIndex('reading_values', ['unit_id', 'parameter', 'taken_at'], { name: 'reading_values_trend' });

  await qi.createTable('flags', {
    id,
    unit_id: ref('units'),
    parameter: { type: DataTypes.STRING(40), allowNull: false },
    origin: { type: DataTypes.ENUM('automatic', 'manual'), allowNull: false },
    severity: { type: DataTypes.ENUM('watch', 'alarm'), allowNull: false },
    status: { type: DataTypes.ENUM('open', 'cleared'), allowNull: false },
    first_reading_set_id: ref('reading_sets', true, DataTypes.BIGINT.UNSIGNED),
    last_reading_set_id: ref('reading_sets', true, DataTypes.BIGINT.UNSIGNED),
    last_value: { type: DataTypes.DOUBLE, allowNull: true },
    raised_at: when(),
    last_seen_at: when(),
    raised_by: ref('users', true),
    comment: { type: DataTypes.STRING(2000), allowNull: true },
    assigned_to: ref('users', true),
    follow_up: { type: DataTypes.STRING(2000), allowNull: true },
    cleared_by: ref('users', true),
    cleared_at: when(true),
    clear_comment: { type: DataTypes.STRING(2000), allowNull: true },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
  await qi.addIndex('flags', ['unit_id', 'status', 'parameter']);

  await qi.createTable('import_mappings', {
    id,
    unit_id: ref('units'),
    source: { type: DataTypes.STRING(80), allowNull: false },
    mapping: { type: DataTypes.JSON, allowNull: false },
    updated_by: ref('users'),
    updated_at: when(),
  });
  await qi.addIndex('import_mappings', ['unit_id', 'source'], { unique: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['import_mappings', 'flags', 'reading_values', 'reading_countersigns', 'reading_amendments', 'reading_sets', 'limit_set_versions', 'unit_design_versions']) {
    await qi.dropTable(table);
  }
}
