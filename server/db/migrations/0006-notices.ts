import { DataTypes, type QueryInterface } from 'sequelize';

// When a reminder e-mail went out, so each is sent once.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('handovers', 'reminder_sent_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('conditions', 'expiry_notice_sent_at', { type: DataTypes.DATE(3), allowNull: true });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('handovers', 'reminder_sent_at');
  await qi.removeColumn('conditions', 'expiry_notice_sent_at');
}
