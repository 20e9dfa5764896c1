/**
 * Initial schema: users, patterns, revisions, memberships, invitations,
 * password resets, comments, uploads. Foreign keys and indexes are declared
 * here; revisions are made immutable by a trigger.
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
const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const tableOptions = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' };

export async function up(qi: QueryInterface): Promise<void> {
  await qi.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    passwordHash: { type: DataTypes.STRING(100), allowNull: false },
    roles: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
    sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    ...timestamps,
  }, tableOptions);

  await qi.createTable('patterns', {
    id,
    ownerId: fk('users', 'RESTRICT'),
    title: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.ENUM('draft', 'in-review', 'approved', 'released'), allowNull: false, defaultValue: 'draft' },
    latestRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    approvedRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    releasedRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('patterns', ['ownerId', 'updatedAt'], { name: 'patterns_owner_updated' });

  await qi.createTable('revisions', {
    id,
    patternId: fk('patterns', 'CASCADE'),
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    source: { type: DataTypes.TEXT('medium'), allowNull: false },
    authorId: fk('users', 'RESTRICT'),
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    summary: { type: DataTypes.TEXT('long'), allowNull: true },
    errors: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    warnings: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  // Numbering is unique per pattern: the last line of defence against two concurrent saves.
  await qi.addIndex('revisions', ['patternId', 'number'], { unique: true, name: 'revisions_pattern_number' });
  await qi.addIndex('revisions', ['authorId'], { name: 'revisions_author' });
  await qi.sequelize.query(
    "CREATE TRIGGER revisions_immutable BEFORE UPDATE ON revisions FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'revisions are immutable'",
  );

  await qi.createTable('memberships', {
    id,
    patternId: fk('patterns', 'CASCADE'),
    userId: fk('users', 'CASCADE'),
    role: { type: DataTypes.ENUM('editor', 'test-knitter', 'knitter'), allowNull: false },
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('memberships', ['patternId', 'userId'], { unique: true, name: 'memberships_pattern_user' });
  await qi.addIndex('memberships', ['userId'], { name: 'memberships_user' });

  await qi.createTable('invitations', {
    id,
    patternId: fk('patterns', 'CASCADE'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.ENUM('editor', 'test-knitter', 'knitter'), allowNull: false },
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    invitedById: fk('users', 'CASCADE'),
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    acceptedAt: { type: DataTypes.DATE(3), allowNull: true },
    acceptedById: fk('users', 'SET NULL', true),
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('invitations', ['patternId', 'email'], { name: 'invitations_pattern_email' });

  await qi.createTable('password_resets', {
    id,
    userId: fk('users', 'CASCADE'),
    tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE(3), allowNull: false },
    usedAt: { type: DataTypes.DATE(3), allowNull: true },
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('password_resets', ['userId'], { name: 'password_resets_user' });

  await qi.createTable('comments', {
    id,
    revisionId: fk('revisions', 'CASCADE'),
    authorId: fk('users', 'CASCADE'),
    round: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    fromLine: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    toLine: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('comments', ['revisionId'], { name: 'comments_revision' });

  await qi.createTable('uploads', {
    id,
    ownerId: fk('users', 'CASCADE'),
    patternId: fk('patterns', 'CASCADE', true),
    kind: { type: DataTypes.ENUM('swatch', 'source'), allowNull: false },
    originalName: { type: DataTypes.STRING(255), allowNull: false },
    mimeType: { type: DataTypes.STRING(100), allowNull: false },
    size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    storageKey: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  await qi.addIndex('uploads', ['patternId'], { name: 'uploads_pattern' });
}

export async function down(qi: QueryInterface): Promise<void> {
  for (const t of ['uploads', 'comments', 'password_resets', 'invitations', 'memberships']) await qi.dropTable(t);
  await qi.sequelize.query('DROP TRIGGER IF EXISTS revisions_immutable');
  for (const t of ['revisions', 'patterns', 'users']) await qi.dropTable(t);
}
