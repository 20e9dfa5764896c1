/**
 * The shop: listings (products) of released patterns, their prices, photos,
 * orders, entitlements (a buyer's read access to a pattern) and the payment
 * provider's webhook events already processed. Money is always an integer
 * amount in the currency's minor unit (cents, pence; yen have none).
 */
import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
const fk = (table: string, onDelete: 'CASCADE' | 'RESTRICT' | 'SET NULL', allowNull = false) => ({
  type: DataTypes.INTEGER.UNSIGNED,
  allowNull,
  references: { model: table, key: 'id' },
  onDelete,
  onUpdate: 'CASCADE',
});
const timestamps = {
  createdAt: { type: DataTypes.DATE(3), allowNull: false },
  updatedAt: { type: DataTypes.DATE(3), allowNull: false },
};
const tableOptions = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' };

/** Order states; only `paid` (and `refund-pending` until the refund lands) carry access. */
const ORDER_STATUSES = ['pending', 'paid', 'failed', 'expired', 'cancelled', 'refund-pending', 'refunded'];

export async function up(qi: QueryInterface): Promise<void> {
  // One listing per pattern; `active` says whether it is on sale now.
  await qi.createTable('products', {
    id,
    patternId: { ...fk('patterns', 'CASCADE'), unique: true },
    description: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('products', ['active'], { name: 'products_active' });

  // Prices are immutable: a new price is a new row, so past orders keep theirs.
  await qi.createTable('prices', {
    id,
    productId: fk('products', 'CASCADE'),
    currency: { type: DataTypes.CHAR(3), allowNull: false },
    unitAmount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    taxInclusive: { type: DataTypes.BOOLEAN, allowNull: false },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    createdAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
  await qi.addIndex('prices', ['productId', 'active'], { name: 'prices_product_active' });

  await qi.createTable('product_photos', {
    id,
    productId: fk('products', 'CASCADE'),
    uploadId: fk('uploads', 'CASCADE'),
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
  }, tableOptions);
  await qi.addIndex('product_photos', ['productId', 'uploadId'], { unique: true, name: 'product_photos_product_upload' });

  await qi.createTable('orders', {
    id,
    productId: fk('products', 'RESTRICT'),
    priceId: fk('prices', 'RESTRICT'),
    patternId: fk('patterns', 'RESTRICT'),
    buyerId: fk('users', 'RESTRICT'),
    // The released revision when the order was placed, and its label if it had one.
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
    ...timestamps,
  }, tableOptions);
  await qi.addIndex('orders', ['buyerId', 'createdAt'], { name: 'orders_buyer_created' });
  await qi.addIndex('orders', ['patternId', 'createdAt'], { name: 'orders_pattern_created' });
  await qi.addIndex('orders', ['paymentIntentId'], { name: 'orders_payment_intent' });

  // Access is to the pattern, not to one revision: a later release reaches every buyer.
  await qi.createTable('entitlements', {
    id,
    userId: fk('users', 'CASCADE'),
    patternId: fk('patterns', 'CASCADE'),
    orderId: fk('orders', 'RESTRICT'),
    grantedAt: { type: DataTypes.DATE(3), allowNull: false },
    revokedAt: { type: DataTypes.DATE(3), allowNull: true },
  }, tableOptions);
  await qi.addIndex('entitlements', ['userId', 'patternId'], { unique: true, name: 'entitlements_user_pattern' });
  await qi.addIndex('entitlements', ['patternId'], { name: 'entitlements_pattern' });

  // The provider's event ids already handled: a replayed or doubled delivery changes nothing.
  await qi.createTable('payment_events', {
    id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    type: { type: DataTypes.STRING(100), allowNull: false },
    orderId: fk('orders', 'SET NULL', true),
    receivedAt: { type: DataTypes.DATE(3), allowNull: false },
  }, tableOptions);
}

export async function down(qi: QueryInterface): Promise<void> {
  for (const t of ['payment_events', 'entitlements', 'orders', 'product_photos', 'prices', 'products']) await qi.dropTable(t);
}
