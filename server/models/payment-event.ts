/** A payment-provider webhook event already handled (its id is the primary key). */
import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Row of `payment_events`: inserting the id twice fails, which makes handling idempotent. */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  /** The provider's event id (e.g. "evt_..."). */
  declare id: string;
  declare type: string;
  declare orderId: number | null;
  declare receivedAt: Date;
}

/** Binds the PaymentEvent model to `sequelize`. */
export function initPaymentEvent(sequelize: Sequelize): void {
  PaymentEvent.init({
    id: { type: DataTypes.STRING(255), primaryKey: true },
    type: { type: DataTypes.STRING(100), allowNull: false },
    orderId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    receivedAt: { type: DataTypes.DATE(3), allowNull: false },
  }, { sequelize, tableName: 'payment_events', timestamps: false });
}
