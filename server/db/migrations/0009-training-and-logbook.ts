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

// Training and logbook review.
// - Qualification tasks are versioned row by row: an edit inserts the next version of the same
//   task key, so entries and decisions keep pointing at the version they were made against.
// - Training entries and trainer decisions are only inserted; corrections are amendments.
// - logbook_documents is the search index over the logbook (one row per searchable record,
//   FULLTEXT over title, body and joined terms), kept by model hooks in the writer's transaction.
// - Review comments point at a logbook document and are only inserted.
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('qualification_tasks', {
    id,
    task_key: { type: DataTypes.STRING(24), allowNull: false },
    version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    position: { type: DataTypes.STRING(40), allowNull: false },
    system: { type: DataTypes.STRING(40), allowNull: false },
    title: { type: DataTypes.STRING(200), allowNull: false },
    standard: { type: DataTypes.STRING(2000), allowNull: false },
    procedure_ref: { type: DataTypes.STRING(80), allowNull: true },
    required_performances: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    retired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    change_note: { type: DataTypes.STRING(500), allowNull: true },
    created_by: ref('users'),
    created_at: when(),
  });
  await qi.addIndex('qualification_tasks', ['task_key', 'version'], { unique: true });

  await qi.createTable('training_entries', {
    id,
    trainee_id: ref('users'),
    task_id: ref('qualification_tasks'),
    performed_on: { type: DataTypes.DATEONLY, allowNull: false },
    level: { type: DataTypes.ENUM('observed', 'supervised', 'alone'), allowNull: false },
    unit_id: ref('units', true),
    shift_start: when(true),
    reading_set_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: true, references: { model: 'reading_sets', key: 'id' } },
    handover_item_id: ref('handover_items', true),
    note: { type: DataTypes.STRING(2000), allowNull: false },
    supervisor_id: ref('users', true),
    status: { type: DataTypes.ENUM('awaiting_countersign', 'countersigned', 'rejected'), allowNull: false },
    countersigned_by: ref('users', true),
    countersigned_at: when(true),
    reject_reason: { type: DataTypes.STRING(1000), allowNull: true },
    recorded_at: when(),
  });
  await qi.addIndex('training_entries', ['trainee_id', 'task_id']);
  await qi.addIndex('training_entries', ['status']);

  await qi.createTable('training_decisions', {
    id,
    trainee_id: ref('users'),
    task_id: ref('qualification_tasks'),
    task_key: { type: DataTypes.STRING(24), allowNull: false },
    decision: { type: DataTypes.ENUM('signed_off', 'returned'), allowNull: false },
    comments: { type: DataTypes.STRING(2000), allowNull: false },
    trainer_id: ref('users'),
    decided_at: when(),
  });
  await qi.addIndex('training_decisions', ['trainee_id', 'task_key']);

  await qi.createTable('training_amendments', {
    id,
    target: { type: DataTypes.ENUM('entry', 'decision'), allowNull: false },
    target_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    author_id: ref('users'),
    amended_at: when(),
    reason: { type: DataTypes.STRING(1000), allowNull: false },
    text: { type: DataTypes.STRING(2000), allowNull: false },
  });
  await qi.addIndex('training_amendments', ['target', 'target_id']);

  await qi.createTable('logbook_documents', {
    id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(24), allowNull: false },
    ref_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false },
    unit_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    station_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    occurred_at: when(),
    shift_start: when(true),
    crew_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    person_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    severity: { type: DataTypes.STRING(16), allowNull: true },
    title: { type: DataTypes.STRING(300), allowNull: false },
    body: { type: DataTypes.TEXT('medium'), allowNull: false },
    // Tags and other hyphenated terms (1-CWP-B, WP-1187) as single words (1_cwp_b), which the
    // FULLTEXT parser would otherwise split into fragments too short to index.
    terms: { type: DataTypes.TEXT, allowNull: true },
  });
  await qi.addIndex('logbook_documents', ['kind', 'ref_id'], { unique: true });
  await qi.addIndex('logbook_documents', ['unit_id', 'occurred_at']);
  await qi.addIndex('logbook_documents', ['station_id', 'occurred_at']);
  await qi.addIndex('logbook_documents', ['title', 'body', 'terms'], { type: 'FULLTEXT', name: 'logbook_documents_text' });

  await qi.createTable('review_comments', {
    id,
    document_id: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, references: { model: 'logbook_documents', key: 'id' } },
    author_id: ref('users'),
    body: { type: DataTypes.STRING(4000), allowNull: false },
    created_at: when(),
  });
  await qi.addIndex('review_comments', ['document_id']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const table of ['review_comments', 'logbook_documents', 'training_amendments', 'training_decisions', 'training_entries', 'qualification_tasks']) {
    await qi.dropTable(table);
  }
}
