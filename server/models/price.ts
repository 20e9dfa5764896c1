/** A price of a listing. Immutable: changing the price adds a row and deactivates the old one. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Row of `prices`. `unitAmount` is an integer in the currency's minor unit. */
export class Price extends Model<InferAttributes<Price>, InferCreationAttributes<Price>> {
  declare id: CreationOptional<number>;
  declare productId: number;
  /** ISO 4217 code, upper case (e.g. "EUR"). */
  declare currency: string;
  /** Integer, minor units (e.g. 650 = 6.50 EUR; 800 = 800 JPY). */
  declare unitAmount: number;
  /** True when the amount already includes sales tax / VAT. */
  declare taxInclusive: boolean;
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
}

/** Binds the Price model to `sequelize`. */
export function initPrice(sequelize: Sequelize): void {
  Price.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    productId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    unitAmount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    taxInclusive: { type: DataTypes.BOOLEAN, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    createdAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'prices', updatedAt: false });
}
