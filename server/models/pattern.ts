/** A pattern: owner, title, review status and the revision numbers that matter. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user.ts';

export const PATTERN_STATUSES = ['draft', 'in-review', 'changes-requested', 'approved', 'released'] as const;
export type PatternStatus = (typeof PATTERN_STATUSES)[number];

/** Row of `patterns`; `latestRevision` is advanced only inside the save transaction. */
export class Pattern extends Model<InferAttributes<Pattern>, InferCreationAttributes<Pattern>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User['id']>;
  declare title: string;
  declare status: CreationOptional<PatternStatus>;
  /** Number of the newest revision (0 only while the first one is being written). */
  declare latestRevision: CreationOptional<number>;
  /** Revision the editor approved, if any. */
  declare approvedRevision: CreationOptional<number | null>;
  /** Revision knitters see, if released. */
  declare releasedRevision: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare owner?: NonAttribute<User>;
}

/** Binds the Pattern model to `sequelize`. */
export function initPattern(sequelize: Sequelize): void {
  Pattern.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    title: { type: DataTypes.STRING(200), allowNull: false },
    status: { type: DataTypes.ENUM(...PATTERN_STATUSES), allowNull: false, defaultValue: 'draft' },
    latestRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    approvedRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    releasedRevision: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'patterns' });
}
