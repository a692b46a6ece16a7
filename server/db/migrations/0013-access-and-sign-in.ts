import { DataTypes, type QueryInterface } from 'sequelize';

// - log_entries.written_as_trainee: a trainee's entry is marked as such for as long as it exists,
//   whatever the author's role becomes later. Entries written before the column existed take the
//   author's role now: the best evidence there is (nothing else recorded the role at the time).
// - sign_in_failures: one row per failed (or still running) sign-in, so the lock-out per account and
//   the ceiling per address hold across server processes and restarts.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('log_entries', 'written_as_trainee', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.sequelize.query(
    `UPDATE log_entries e JOIN users u ON u.id = e.author_id SET e.written_as_trainee = 1 WHERE u.role = 'trainee'`,
  );
  await qi.createTable('sign_in_failures', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    // The e-mail as typed (trimmed, lower case), whether or not anyone has it: an unknown address
    // is locked the same way, so a lock reveals nothing.
    email: { type: DataTypes.STRING(254), allowNull: false },
    address: { type: DataTypes.STRING(64), allowNull: false },
    failed_at: { type: DataTypes.DATE(3), allowNull: false },
    // Set when the account signs in: its earlier failures stop counting towards its lock-out but
    // still count against the address they came from.
    account_reset: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  });
  await qi.addIndex('sign_in_failures', ['email', 'failed_at'], { name: 'sign_in_failures_email' });
  await qi.addIndex('sign_in_failures', ['address', 'failed_at'], { name: 'sign_in_failures_address' });
  await qi.addIndex('sign_in_failures', ['failed_at'], { name: 'sign_in_failures_age' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('sign_in_failures');
  await qi.removeColumn('log_entries', 'written_as_trainee');
}
