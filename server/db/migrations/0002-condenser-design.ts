import { DataTypes, type QueryInterface } from 'sequelize';

// Design data the condenser checks need. Stored in SI; the plant-setup screens convert.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('condenser_designs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    unit_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      allowNull: false,
      unique: true,
      references: { model: 'units', key: 'id' },
      onDelete: 'RESTRICT',
    },
    surface_area_m2: { type: DataTypes.DOUBLE, allowNull: false },
    tube_od_mm: { type: DataTypes.DOUBLE, allowNull: false },
    tube_gauge_bwg: { type: DataTypes.INTEGER, allowNull: false },
    tube_material: { type: DataTypes.STRING(40), allowNull: false },
    tube_count: { type: DataTypes.INTEGER, allowNull: false },
    passes: { type: DataTypes.INTEGER, allowNull: false },
    design_cw_flow_kg_s: { type: DataTypes.DOUBLE, allowNull: false },
    design_cw_inlet_k: { type: DataTypes.DOUBLE, allowNull: false },
    design_backpressure_pa: { type: DataTypes.DOUBLE, allowNull: false },
    design_duty_w: { type: DataTypes.DOUBLE, allowNull: false },
    design_cleanliness: { type: DataTypes.DOUBLE, allowNull: false },
    design_clean_u_w_m2k: { type: DataTypes.DOUBLE, allowNull: true },
    // [[backpressure Pa, MW correction], …] sorted by pressure
    backpressure_correction: { type: DataTypes.JSON, allowNull: false },
    energy_price_per_mwh: { type: DataTypes.DOUBLE, allowNull: true },
    currency: { type: DataTypes.STRING(8), allowNull: true },
    created_at: { type: DataTypes.DATE(3), allowNull: false },
    updated_at: { type: DataTypes.DATE(3), allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('condenser_designs');
}
