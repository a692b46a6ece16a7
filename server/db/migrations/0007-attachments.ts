import { DataTypes, type QueryInterface } from 'sequelize';

// Photos and PDFs on handover items. The bytes live in the storage module (local folder or an
// S3-compatible store); this table keeps what they are and who added them.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('handover_attachments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    item_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'handover_items', key: 'id' }, onDelete: 'RESTRICT' },
    file_name: { type: DataTypes.STRING(200), allowNull: false },
    mime: { type: DataTypes.STRING(80), allowNull: false },
    size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    storage_key: { type: DataTypes.STRING(200), allowNull: false },
    uploaded_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'RESTRICT' },
    uploaded_at: { type: DataTypes.DATE(3), allowNull: false },
  });
  await qi.addIndex('handover_attachments', ['item_id']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('handover_attachments');
}
