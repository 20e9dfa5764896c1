/**
 * Review, release and the knitter's side: the `changes-requested` status,
 * comment threads (replies) and errata on comments, the review event log,
 * releases (a labelled, frozen revision) and knitting progress per knitter,
 * release and size. Release rows are frozen by triggers: no UPDATE, no
 * DELETE (a cascade from a deleted pattern is not a statement and still works).
 */
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const fk = (table: string, onDelete: 'CASCADE' | 'RESTRICT' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const tableOptions = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' };

export async function up(qi: QueryInterface): Promise<void> {
  await qi.changeColumn('patterns', 'status', {
    type: DataTypes.ENUM('draft', 'in-review', 'changes-requested', 'approved', 'released'),
    allowNull: false,
    defaultValue: 'draft',
  });

  await qi.addColumn('comments', 'parentId', fk('comments', 'CASCADE', true));
  await qi.addColumn('comments', 'kind', { type: DataTypes.ENUM('comment', 'erratum'), allowNull: false, defaultValue: 'comment' });
  await qi.addColumn('comments', 'size', { type: DataTypes.STRING(100), allowNull: true });

  await qi.createTable('review_events', {
    id,
    patternId: fk('patterns', 'CASCADE'),
    actorId: fk('users', 'CASCADE'),
    event: { type: DataTypes.ENUM('submit', 'withdraw', 'approve', 'request-changes', 'release'), allowNull: false },
    fromStatus: { type: DataTypes.STRING(20), allowNull: false },
    toStatus: { type: DataTypes.STRING(20), allowNull: false },
    revisionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    editorId: fk('users', 'SET NULL', true),
    message: { type: DataTypes.TEXT, allowNull: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  await qi.addIndex('review_events', ['patternId', 'id'], { name: 'review_events_pattern' });

  await qi.createTable('releases', {
    id,
    patternId: fk('patterns', 'CASCADE'),
    revisionId: fk('revisions', 'CASCADE'),
    revisionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    label: { type: DataTypes.STRING(20), allowNull: false },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    releasedById: fk('users', 'RESTRICT'),
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  // A label names one release of a pattern; a revision is released at most once (an erratum is a new revision).
  await qi.addIndex('releases', ['patternId', 'label'], { unique: true, name: 'releases_pattern_label' });
  await qi.addIndex('releases', ['patternId', 'revisionNumber'], { unique: true, name: 'releases_pattern_revision' });
  await qi.sequelize.query(
    "CREATE TRIGGER releases_frozen_update BEFORE UPDATE ON releases FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'releases are frozen'",
  );
  await qi.sequelize.query(
    "CREATE TRIGGER releases_frozen_delete BEFORE DELETE ON releases FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'releases are frozen'",
  );

  await qi.createTable('knitting_progress', {
    id,
    userId: fk('users', 'CASCADE'),
    releaseId: fk('releases', 'CASCADE'),
    size: { type: DataTypes.STRING(100), allowNull: false },
    roundsDone: { type: DataTypes.TEXT, allowNull: false },
    currentRound: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
    updatedAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  await qi.addIndex('knitting_progress', ['userId', 'releaseId', 'size'], { unique: true, name: 'knitting_progress_user_release_size' });
}

export async function down(qi: QueryInterface): Promise<void> {
  await qi.dropTable('knitting_progress');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS releases_frozen_update');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS releases_frozen_delete');
  await qi.dropTable('releases');
  await qi.dropTable('review_events');
  await qi.removeColumn('comments', 'size');
  await qi.removeColumn('comments', 'kind');
  await qi.removeColumn('comments', 'parentId');
  await qi.sequelize.query("UPDATE patterns SET status = 'draft' WHERE status = 'changes-requested'");
  await qi.changeColumn('patterns', 'status', { type: DataTypes.ENUM('draft', 'in-review', 'approved', 'released'), allowNull: false, defaultValue: 'draft' });
}
