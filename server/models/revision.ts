/**
 * An immutable revision of a pattern source. `number` counts from 1 per
 * pattern; `summary` is the compile summary computed on the server.
 * A database trigger rejects every UPDATE, and the model refuses saves of
 * existing rows, so a revision never changes after it is written.
 */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Pattern } from './pattern.ts';
import type { User } from './user.ts';

/** Per-size round counts and diagnostic totals, as produced by `summarizeForStorage`. */
export interface StoredSummary {
  errors: number;
  warnings: number;
  sizes: { name: string; rounds: { number: number; front: number; backing: number; total: number }[] }[];
}

/** Row of `revisions`; unique per (pattern, number); never updated. */
export class Revision extends Model<InferAttributes<Revision>, InferCreationAttributes<Revision>> {
  declare id: CreationOptional<number>;
  declare patternId: ForeignKey<Pattern['id']>;
  declare number: number;
  declare source: string;
  declare authorId: ForeignKey<User['id']>;
  declare message: string;
  declare summary: StoredSummary | null;
  declare errors: number;
  declare warnings: number;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
}

/** Binds the Revision model to `sequelize`; its update hook refuses every change. */
export function initRevision(sequelize: Sequelize): void {
  Revision.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    source: { type: DataTypes.TEXT('medium'), allowNull: false },
    message: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    summary: {
      type: DataTypes.TEXT('long'),
      allowNull: true,
      get(): StoredSummary | null {
        const raw = this.getDataValue('summary') as unknown as string | null;
        return raw ? (JSON.parse(raw) as StoredSummary) : null;
      },
      set(value: StoredSummary | null) {
        this.setDataValue('summary', (value === null ? null : JSON.stringify(value)) as unknown as StoredSummary);
      },
    },
    errors: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    warnings: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    createdAt: DataTypes.DATE(3),
  }, {
    sequelize,
    tableName: 'revisions',
    updatedAt: false,
    hooks: {
      beforeUpdate() {
        throw new Error('revisions are immutable');
      },
    },
  });
}
