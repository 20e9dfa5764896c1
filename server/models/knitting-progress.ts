/** Where one knitter is in one release of a pattern, for one size. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Release } from './release.ts';
import type { User } from './user.ts';

/** Row of `knitting_progress`; unique per (user, release, size). */
export class KnittingProgress extends Model<InferAttributes<KnittingProgress>, InferCreationAttributes<KnittingProgress>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare releaseId: ForeignKey<Release['id']>;
  declare size: string;
  /** Round numbers marked done, ascending, no repeats (stored as JSON text). */
  declare roundsDone: number[];
  /** The round the knitter is on, or null. */
  declare currentRound: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the KnittingProgress model to `sequelize`. */
export function initKnittingProgress(sequelize: Sequelize): void {
  KnittingProgress.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    size: { type: DataTypes.STRING(100), allowNull: false },
    roundsDone: {
      type: DataTypes.TEXT,
      allowNull: false,
      get(): number[] {
        const raw = this.getDataValue('roundsDone') as unknown as string | null;
        return raw ? (JSON.parse(raw) as number[]) : [];
      },
      set(value: number[]) {
        this.setDataValue('roundsDone', JSON.stringify(value) as unknown as number[]);
      },
    },
    currentRound: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'knitting_progress' });
}
