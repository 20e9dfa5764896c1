/**
 * The designer's sales: every order of their listed patterns (date, buyer,
 * version, amount, status), totals per pattern, month and currency (integer
 * minor units; net = paid minus refunded), a CSV export, and refunds, which
 * go to the provider through the SDK; the provider's `charge.refunded`
 * webhook then revokes the buyer's access.
 */
import { Op } from 'sequelize';
import type { ApiOrder, ApiSalesTotal } from '../../shared/shop/api.ts';
import { minorToDecimal } from '../../shared/shop/money.ts';
import { Order, Pattern, User } from '../models/index.ts';
import { authorizePattern, requireUser } from './access.ts';
import { AppError, conflict, notFound } from './errors.ts';
import type { Payments } from './payments.ts';
import { requirePayments } from './shop-checkout.ts';
import { currencyOf, toApiOrder } from './shop-serialize.ts';

/** Orders that were paid at some point (they count in the totals). */
const PAID_ONCE = ['paid', 'refund-pending', 'refunded'] as const;

/** Orders of every pattern `user` owns, newest first (pending checkouts included, with their status). */
export async function listSales(user: User | null): Promise<{ orders: ApiOrder[]; totals: ApiSalesTotal[] }> {
  const designer = requireUser(user);
  const orders = await Order.findAll({
    include: [
      { model: Pattern, as: 'pattern', required: true, where: { ownerId: designer.id }, attributes: ['id', 'title', 'ownerId'] },
      { model: User, as: 'buyer', attributes: ['id', 'name', 'email'] },
    ],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return { orders: orders.map((o) => toApiOrder(o, o.pattern!.title, o.buyer ?? null)), totals: totalsOf(orders) };
}

/** Totals per (pattern, month of payment in UTC, currency), newest month first, then by title. */
export function totalsOf(orders: readonly Order[]): ApiSalesTotal[] {
  const groups = new Map<string, ApiSalesTotal>();
  for (const o of orders) {
    if (!(PAID_ONCE as readonly string[]).includes(o.status) || !o.paidAt) continue;
    const month = o.paidAt.toISOString().slice(0, 7);
    const key = `${o.patternId}|${month}|${o.currency}`;
    let g = groups.get(key);
    if (!g) {
      g = { patternId: o.patternId, title: o.pattern?.title ?? '', month, currency: currencyOf(o.currency), orders: 0, gross: 0, refunded: 0, net: 0 };
      groups.set(key, g);
    }
    g.orders += 1;
    g.gross += o.amount;
    if (o.status === 'refunded') g.refunded += o.amount;
    g.net = g.gross - g.refunded;
  }
  return [...groups.values()].sort((a, b) => b.month.localeCompare(a.month) || a.title.localeCompare(b.title) || a.currency.localeCompare(b.currency));
}

/**
 * One CSV field (RFC 4180: quoted when it holds a comma, quote, CR or LF;
 * quotes doubled). Text starting with = + - @ or a tab/CR is prefixed with
 * an apostrophe so spreadsheets do not run it as a formula (OWASP's advice
 * on CSV injection); numbers are written as they are.
 */
export function csvField(value: string | number | boolean | null): string {
  if (value === null) return '';
  if (typeof value !== 'string') return String(value);
  const safe = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/** The sales table as CSV (CRLF line ends, header row first). */
export function salesCsv(orders: readonly ApiOrder[]): string {
  const header = ['order', 'date', 'pattern', 'version', 'buyer', 'buyer_email', 'currency', 'amount', 'amount_minor', 'tax_inclusive', 'status', 'refunded_at'];
  const rows = orders.map((o) => [
    o.id, o.paidAt ?? o.createdAt, o.title, o.version, o.buyer?.name ?? '', o.buyer?.email ?? '', o.price.currency,
    minorToDecimal(o.price.amount, o.price.currency), o.price.amount, o.price.taxInclusive, o.status, o.refundedAt,
  ].map(csvField).join(','));
  return [header.join(','), ...rows].join('\r\n') + '\r\n';
}

/**
 * Refunds a paid order of the designer's pattern through the provider.
 * The order is `refund-pending` until the provider's `charge.refunded`
 * webhook arrives; then access is revoked. 409 unless the order is paid.
 */
export async function refundOrder(payments: Payments | null, user: User | null, orderId: number): Promise<ApiOrder> {
  requireUser(user);
  const order = Number.isSafeInteger(orderId) ? await Order.findByPk(orderId, { include: [{ model: User, as: 'buyer' }] }) : null;
  if (!order) throw notFound('That order');
  const { pattern } = await authorizePattern(user, order.patternId, 'sell').catch((err: unknown) => {
    if (err instanceof AppError && err.status === 403) throw notFound('That order');
    throw err;
  });
  if (order.status !== 'paid' || !order.paymentIntentId) throw conflict('not-refundable', `Only paid orders can be refunded; this one is ${order.status}.`);
  const provider = requirePayments(payments);
  let refund;
  try {
    refund = await provider.stripe.refunds.create(
      { payment_intent: order.paymentIntentId, reason: 'requested_by_customer', metadata: { orderId: String(order.id) } },
      { idempotencyKey: `loopwright-refund-${order.id}` },
    );
  } catch (err) {
    console.error(`refund of order ${order.id} failed:`, err instanceof Error ? err.message : err);
    throw new AppError(502, 'payment-provider-error', `The payment provider refused the refund: ${err instanceof Error ? err.message : 'unknown error'}`);
  }
  // The webhook may have landed already (it follows the answer closely); never step back from refunded.
  await Order.update({ status: 'refund-pending', refundId: refund.id }, { where: { id: order.id, status: 'paid' } });
  await Order.update({ refundId: refund.id }, { where: { id: order.id, refundId: { [Op.is]: null } } });
  await order.reload();
  return toApiOrder(order, pattern.title, order.buyer ?? null);
}
