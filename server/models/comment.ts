/** A review comment on a revision, anchored to a round and/or a line span. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Revision } from './revision.ts';
import type { User } from './user.ts';

export class Comment extends Model<InferAttributes<Comment>, InferCreationAttributes<Comment>> {
  declare id: CreationOptional<number>;
  declare revisionId: ForeignKey<Revision['id']>;
  declare authorId: ForeignKey<User['id']>;
  /** Round number the comment is about, if any. */
  declare round: CreationOptional<number | null>;
  /** 1-based source lines, inclusive. */
  declare fromLine: CreationOptional<number | null>;
  declare toLine: CreationOptional<number | null>;
  declare body: string;
  declare resolved: CreationOptional<boolean>;
  /** The thread's first comment when this is a reply (replies are one level deep). */
  declare parentId: CreationOptional<number | null>;
  /** `erratum`: reported by a knitter on a released revision. */
  declare kind: CreationOptional<'comment' | 'erratum'>;
  /** Size the comment is about (errata), if any. */
  declare size: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
}

/** Binds the Comment model to `sequelize` (table `comments`). */
export function initComment(sequelize: Sequelize): void {
  Comment.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    round: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    fromLine: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    toLine: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    body: { type: DataTypes.TEXT, allowNull: false },
    resolved: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    parentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    kind: { type: DataTypes.ENUM('comment', 'erratum'), allowNull: false, defaultValue: 'comment' },
    size: { type: DataTypes.STRING(100), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'comments' });
}
