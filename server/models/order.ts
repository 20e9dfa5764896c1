/** A purchase of a listing by a signed-in knitter, from checkout to payment (or not) and refund. */
import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Pattern } from './pattern.ts';
import type { User } from './user.ts';

export const ORDER_STATUSES = ['pending', 'paid', 'failed', 'expired', 'cancelled', 'refund-pending', 'refunded'] as const;
/** `pending` until the provider says paid; `paid` and `refund-pending` carry access, nothing else does. */
export type OrderStatus = (typeof ORDER_STATUSES)[number];

/** Row of `orders`. Amounts are integers in minor units, copied from the price at checkout. */
export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: CreationOptional<number>;
  declare productId: number;
  declare priceId: number;
  declare patternId: number;
  declare buyerId: number;
  /** Released revision when the order was placed. */
  declare revisionNumber: number;
  /** Release label (e.g. "1.0") when the pattern had one, else null. */
  declare versionLabel: string | null;
  declare currency: string;
  /** Integer, minor units. */
  declare amount: number;
  declare taxInclusive: boolean;
  declare status: CreationOptional<OrderStatus>;
  declare checkoutSessionId: string | null;
  declare paymentIntentId: CreationOptional<string | null>;
  declare refundId: CreationOptional<string | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare receiptSentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare buyer?: NonAttribute<User>;
  declare pattern?: NonAttribute<Pattern>;
}

/** Binds the Order model to `sequelize`. */
export function initOrder(sequelize: Sequelize): void {
  Order.init({
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    productId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    priceId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    patternId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    buyerId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    revisionNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    versionLabel: { type: DataTypes.STRING(40), allowNull: true },
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    amount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    taxInclusive: { type: DataTypes.BOOLEAN, allowNull: false },
    status: { type: DataTypes.ENUM(...ORDER_STATUSES), allowNull: false, defaultValue: 'pending' },
    checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
    refundId: { type: DataTypes.STRING(255), allowNull: true },
    paidAt: { type: DataTypes.DATE(3), allowNull: true },
    refundedAt: { type: DataTypes.DATE(3), allowNull: true },
    receiptSentAt: { type: DataTypes.DATE(3), allowNull: true },
    createdAt: DataTypes.DATE(3),
    updatedAt: DataTypes.DATE(3),
  }, { sequelize, tableName: 'orders' });
}
