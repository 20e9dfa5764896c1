/** An uploaded file's metadata; the bytes live in the storage backend under `storageKey`. */
import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { User } from './user.ts';

export const UPLOAD_KINDS = ['swatch', 'source'] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** Row of `uploads`. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare ownerId: ForeignKey<User['id']>;
  declare patternId: number | null;
  declare kind: UploadKind;
  /** The client's file name, for display only; never used as a path. */
  declare originalName: string;
  declare mimeType: string;
  /** Bytes. */
  declare size: number;
  declare storageKey: string;
  declare createdAt: CreationOptional<Date>;
}

/** Binds the Upload model to `sequelize`. */
export function initUpload(sequelize: Sequelize): void {
  Upload.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    patternId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    kind: { type: DataTypes.ENUM(...UPLOAD_KINDS), allowNull: false },
    originalName: { type: DataTypes.STRING(255), allowNull: false },
    mimeType: { type: DataTypes.STRING(100), allowNull: false },
    size: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    storageKey: { type: DataTypes.STRING(100), allowNull: false, unique: true },
    createdAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'uploads', updatedAt: false });
}
