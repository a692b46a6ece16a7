import { DataTypes, type QueryInterface } from 'sequelize';

// The condenser's state over the shift as the outgoing crew handed it over, written once at
// submit; drafts and handovers submitted before this column existed have none.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('handovers', 'condenser_snapshot', { type: DataTypes.JSON, allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('handovers', 'condenser_snapshot');
}
