/**
 * A release: one revision of a pattern published to its knitters under a
 * version label ("1.0", "1.1"). Rows are frozen: the model refuses updates
 * and deletes, and database triggers back that up.
 */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Pattern } from './pattern.ts';
import type { Revision } from './revision.ts';
import type { User } from './user.ts';

/** Row of `releases`; unique per (pattern, label) and per (pattern, revisionNumber); never changed. */
export class Release extends Model<InferAttributes<Release>, InferCreationAttributes<Release>> {
  declare id: CreationOptional<number>;
  declare patternId: ForeignKey<Pattern['id']>;
  declare revisionId: ForeignKey<Revision['id']>;
  /** The released revision's number (denormalised for lookups by label or number). */
  declare revisionNumber: number;
  /** Version label, e.g. "1.0"; see RELEASE_LABEL in shared/api-schemas.ts. */
  declare label: string;
  declare notes: CreationOptional<string>;
  declare releasedById: ForeignKey<User['id']>;
  declare createdAt: CreationOptional<Date>;
  declare releasedBy?: NonAttribute<User>;
}

/** Binds the Release model to `sequelize`; its hooks refuse every change. */
export function initRelease(sequelize: Sequelize): void {
  Release.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    revisionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    label: { type: DataTypes.STRING(20), allowNull: false },
    notes: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    createdAt: DataTypes.DATE(3),
  }, {
    sequelize,
    tableName: 'releases',
    updatedAt: false,
    hooks: {
      beforeUpdate() {
        throw new Error('releases are frozen');
      },
      beforeDestroy() {
        throw new Error('releases are frozen');
      },
    },
  });
}
