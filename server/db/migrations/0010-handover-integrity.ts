import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';

// Handover integrity:
// - automatic items are unique per (handover, kind, source), so two writers syncing at once cannot
//   attach the same flag twice; duplicates left by earlier versions are folded into the first one;
// - every create from the browser carries a client key, unique per handover or author, so a double
//   click or a retried request makes one record;
// - a draft item can be removed (kept, marked removed, so an automatic one is not attached again)
//   and edited (version);
// - an item's version moves on with each amendment after submit, and an acknowledgement counts for
//   the version it was given to: an amended item needs acknowledging again;
// - automatic items have no person as their author (attached by the system).
export async function up({ context: qi }: { context: QueryInterface }) {
  const sql = (text: string) => qi.sequelize.query(text);

  const duplicates = await qi.sequelize.query<{ keep: number; drop: number }>(
    `SELECT MIN(first.id) AS keep, dup.id AS \`drop\`
     FROM handover_items first JOIN handover_items dup
       ON dup.handover_id = first.handover_id AND dup.kind = first.kind AND dup.source_id = first.source_id AND dup.id > first.id
     WHERE first.source_id IS NOT NULL
     GROUP BY dup.id`,
    { type: QueryTypes.SELECT },
  );
  for (const { keep, drop } of duplicates) {
    await qi.sequelize.query('INSERT IGNORE INTO handover_acks (item_id, user_id, acknowledged_at) SELECT ?, user_id, acknowledged_at FROM handover_acks WHERE item_id = ?', { replacements: [keep, drop] });
    await qi.sequelize.query('DELETE FROM handover_acks WHERE item_id = ?', { replacements: [drop] });
    for (const table of ['handover_queries', 'handover_attachments', 'handover_amendments', 'training_entries']) {
      const column = table === 'training_entries' ? 'handover_item_id' : 'item_id';
      await qi.sequelize.query(`UPDATE ${table} SET ${column} = ? WHERE ${column} = ?`, { replacements: [keep, drop] });
    }
    await qi.sequelize.query("DELETE FROM logbook_documents WHERE kind = 'handover_item' AND ref_id = ?", { replacements: [drop] });
    await qi.sequelize.query('DELETE FROM handover_items WHERE id = ?', { replacements: [drop] });
  }

  // The unique index first: the old one serves the handover_id foreign key until its successor exists.
  await qi.addIndex('handover_items', ['handover_id', 'kind', 'source_id'], { unique: true, name: 'handover_items_source_unique' });
  await sql('ALTER TABLE handover_items DROP INDEX handover_items_handover_id_kind_source_id');
  await qi.addColumn('handover_items', 'client_key', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addIndex('handover_items', ['handover_id', 'client_key'], { unique: true, name: 'handover_items_client_key_unique' });
  await qi.addColumn('handover_items', 'version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 });
  await qi.addColumn('handover_items', 'amended_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('handover_items', 'removed_at', { type: DataTypes.DATE(3), allowNull: true });
  await qi.addColumn('handover_items', 'removed_by', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: 'users', key: 'id' },
    onUpdate: 'CASCADE',
    onDelete: 'RESTRICT',
  });
  // MODIFY keeps the column's foreign key; only NOT NULL goes.
  await sql('ALTER TABLE handover_items MODIFY created_by INT UNSIGNED NULL');

  await qi.addColumn('handover_acks', 'item_version', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 });
  // One statement, so item_id keeps an index for its foreign key throughout.
  await sql('ALTER TABLE handover_acks DROP PRIMARY KEY, ADD PRIMARY KEY (item_id, user_id, item_version)');

  await qi.addColumn('handover_queries', 'client_key', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addIndex('handover_queries', ['asked_by', 'client_key'], { unique: true, name: 'handover_queries_client_key_unique' });
  await qi.addColumn('handover_amendments', 'client_key', { type: DataTypes.STRING(64), allowNull: true });
  await qi.addIndex('handover_amendments', ['author_id', 'client_key'], { unique: true, name: 'handover_amendments_client_key_unique' });
  // A file added after submit is an amendment of its item.
  await qi.addColumn('handover_attachments', 'amendment_id', {
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull: true,
    references: { model: 'handover_amendments', key: 'id' },
    onUpdate: 'CASCADE',
    onDelete: 'RESTRICT',
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('handover_attachments', 'amendment_id');
  await qi.removeIndex('handover_amendments', 'handover_amendments_client_key_unique');
  await qi.removeColumn('handover_amendments', 'client_key');
  await qi.removeIndex('handover_queries', 'handover_queries_client_key_unique');
  await qi.removeColumn('handover_queries', 'client_key');
  await qi.sequelize.query('DELETE FROM handover_acks WHERE item_version > 1');
  await qi.sequelize.query('ALTER TABLE handover_acks DROP PRIMARY KEY, ADD PRIMARY KEY (item_id, user_id)');
  await qi.removeColumn('handover_acks', 'item_version');
  for (const column of ['removed_by', 'removed_at', 'amended_at', 'version']) await qi.removeColumn('handover_items', column);
  await qi.sequelize.query('UPDATE handover_items i JOIN handovers h ON h.id = i.handover_id SET i.created_by = h.created_by WHERE i.created_by IS NULL');
  await qi.sequelize.query('ALTER TABLE handover_items MODIFY created_by INT UNSIGNED NOT NULL');
  await qi.removeIndex('handover_items', 'handover_items_client_key_unique');
  await qi.removeColumn('handover_items', 'client_key');
  await qi.addIndex('handover_items', ['handover_id', 'kind', 'source_id']);
  await qi.removeIndex('handover_items', 'handover_items_source_unique');
}
