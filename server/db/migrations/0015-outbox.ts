import { DataTypes, type QueryInterface } from 'sequelize';

const when = (allowNull: boolean) => ({ type: DataTypes.DATE(3), allowNull });

// Notices (e-mail) are written here in the transaction of the change they tell about, and sent
// afterwards by a sender that claims rows with a guarded UPDATE; a notice is made once per kind and
// record (unique key), and a row is sent once: `sent_at` is set only by the claim's holder.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('outbox', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    ref_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    recipients: { type: DataTypes.JSON, allowNull: false },
    subject: { type: DataTypes.STRING(300), allowNull: false },
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: when(false),
    due_at: when(false),
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    claim_token: { type: DataTypes.STRING(40), allowNull: true },
    claimed_until: when(true),
    last_error: { type: DataTypes.STRING(1000), allowNull: true },
    sent_at: when(true),
  });
  await qi.addIndex('outbox', ['kind', 'ref_id'], { unique: true, name: 'outbox_once' });
  // The sender's claim: unsent rows that are due, oldest first.
  await qi.addIndex('outbox', ['sent_at', 'due_at'], { name: 'outbox_due' });
  await qi.addIndex('outbox', ['claim_token'], { name: 'outbox_claim' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('outbox');
}
