/** A knitter's right to read a pattern's released versions, earned by an order. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Row of `entitlements`; one per (user, pattern); active while `revokedAt` is null. */
export class Entitlement extends Model<InferAttributes<Entitlement>, InferCreationAttributes<Entitlement>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare patternId: number;
  /** The paid order that carries the access now. */
  declare orderId: number;
  declare grantedAt: Date;
  declare revokedAt: CreationOptional<Date | null>;
}

/** Binds the Entitlement model to `sequelize`. */
export function initEntitlement(sequelize: Sequelize): void {
  Entitlement.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    patternId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    orderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    grantedAt: { type: DataTypes.DATE(3), allowNull: false },
    revokedAt: { type: DataTypes.DATE(3), allowNull: true },
  }, { sequelize, tableName: 'entitlements', timestamps: false });
}
