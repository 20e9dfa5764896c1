/** One step of a pattern's review: who moved it from which status to which, about which revision. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ReviewEventName } from '../services/review-status.ts';
import type { Pattern } from './pattern.ts';
import type { User } from './user.ts';

/** Row of `review_events`: an append-only log, oldest first by id. */
export class ReviewEvent extends Model<InferAttributes<ReviewEvent>, InferCreationAttributes<ReviewEvent>> {
  declare id: CreationOptional<number>;
  declare patternId: ForeignKey<Pattern['id']>;
  declare actorId: ForeignKey<User['id']>;
  declare event: ReviewEventName;
  declare fromStatus: string;
  declare toStatus: string;
  /** The revision the step is about (submitted, approved, released), if any. */
  declare revisionNumber: number | null;
  /** For `submit`: the editor asked to review (null: every invited editor). */
  declare editorId: ForeignKey<User['id']> | null;
  declare message: string | null;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User>;
  declare editor?: NonAttribute<User>;
}

/** Binds the ReviewEvent model to `sequelize`. */
export function initReviewEvent(sequelize: Sequelize): void {
  ReviewEvent.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    event: { type: DataTypes.ENUM('submit', 'withdraw', 'approve', 'request-changes', 'release'), allowNull: false },
    fromStatus: { type: DataTypes.STRING(20), allowNull: false },
    toStatus: { type: DataTypes.STRING(20), allowNull: false },
    revisionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    message: { type: DataTypes.TEXT, allowNull: true },
    createdAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'review_events', updatedAt: false });
}
