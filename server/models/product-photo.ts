/** A photo (an existing upload of the pattern) shown on a listing, in order. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Upload } from './upload.ts';

/** Row of `product_photos`; `position` orders the photos from 0. */
export class ProductPhoto extends Model<InferAttributes<ProductPhoto>, InferCreationAttributes<ProductPhoto>> {
  declare id: CreationOptional<number>;
  declare productId: number;
  declare uploadId: number;
  declare position: number;
  declare upload?: NonAttribute<Upload>;
}

/** Binds the ProductPhoto model to `sequelize`. */
export function initProductPhoto(sequelize: Sequelize): void {
  ProductPhoto.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    productId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    uploadId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  }, { sequelize, tableName: 'product_photos', timestamps: false });
}
