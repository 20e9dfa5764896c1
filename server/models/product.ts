/** A listing: a released pattern offered in the shop (one per pattern). */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Pattern } from './pattern.ts';
import type { Price } from './price.ts';
import type { ProductPhoto } from './product-photo.ts';

/** Row of `products`; `active` means on sale now. */
export class Product extends Model<InferAttributes<Product>, InferCreationAttributes<Product>> {
  declare id: CreationOptional<number>;
  declare patternId: number;
  /** Short text for the shop card, at most 1000 characters. */
  declare description: CreationOptional<string>;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare pattern?: NonAttribute<Pattern>;
  declare prices?: NonAttribute<Price[]>;
  declare photos?: NonAttribute<ProductPhoto[]>;
}

/** Binds the Product model to `sequelize`. */
export function initProduct(sequelize: Sequelize): void {
  Product.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    patternId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
    description: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'products' });
}
