/**
 * The payment provider's webhooks. Every request is verified with the SDK's
 * `webhooks.constructEvent` over the raw body (a bad or missing signature,
 * or one older than the tolerance, is refused with 400 and changes
 * nothing). Each event id is stored in `payment_events` in the same
 * transaction as its effect, so a replayed or doubled delivery is answered
 * 200 and does nothing the second time.
 *
 * - `checkout.session.completed` with `payment_status: 'paid'` (or
 *   `checkout.session.async_payment_succeeded`): the order becomes paid and
 *   the buyer's entitlement to the pattern is granted; then a receipt is mailed.
 * - `checkout.session.async_payment_failed`: failed; `checkout.session.expired`:
 *   expired (cancelled if the buyer left). Neither grants anything.
 * - `charge.refunded` (fully refunded): the order becomes refunded and the
 *   entitlement is revoked, unless another paid order of the same buyer
 *   carries it.
 */
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import type Stripe from 'stripe';
import type { ServerContext } from '../context.ts';
import { receiptMail } from '../mail/shop-templates.ts';
import { Entitlement, Order, Pattern, PaymentEvent, User } from '../models/index.ts';
import { badRequest } from './errors.ts';
import type { Payments } from './payments.ts';
import { requirePayments } from './shop-checkout.ts';
import { currencyOf, versionText } from './shop-serialize.ts';

/** What handling one delivery did (for the answer and the tests). */
export interface WebhookOutcome { received: true; duplicate: boolean; type: string; effect: 'granted' | 'revoked' | 'updated' | 'ignored' }

const ACCESS_STATUSES = ['paid', 'refund-pending'] as const;

async function orderForSession(session: Stripe.Checkout.Session, t: Transaction): Promise<Order | null> {
  const bySession = await Order.findOne({ where: { checkoutSessionId: session.id }, transaction: t, lock: t.LOCK.UPDATE });
  if (bySession) return bySession;
  const id = Number(session.metadata?.orderId ?? session.client_reference_id);
  const byId = Number.isSafeInteger(id) && id > 0 ? await Order.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE }) : null;
  // Only an order that never got a session id (the app crashed between the two writes) may be matched by metadata.
  return byId && byId.checkoutSessionId === null ? byId : null;
}

async function grant(order: Order, session: Stripe.Checkout.Session, t: Transaction): Promise<'granted' | 'updated' | 'ignored'> {
  if (order.status !== 'pending' && order.status !== 'cancelled' && order.status !== 'expired' && order.status !== 'failed') return 'ignored';
  // The provider's amount must be what we asked for; anything else is not this order's payment.
  if (session.amount_total !== order.amount || (session.currency ?? '').toUpperCase() !== order.currency.toUpperCase()) {
    console.error(`order ${order.id}: paid ${session.amount_total} ${session.currency}, expected ${order.amount} ${order.currency}; not granted`);
    return 'ignored';
  }
  const paymentIntent = typeof session.payment_intent === 'string' ? session.payment_intent : session.payment_intent?.id ?? null;
  await order.update({ status: 'paid', paidAt: new Date(), paymentIntentId: paymentIntent, checkoutSessionId: session.id }, { transaction: t });
  const existing = await Entitlement.findOne({ where: { userId: order.buyerId, patternId: order.patternId }, transaction: t, lock: t.LOCK.UPDATE });
  if (existing && existing.revokedAt === null) return 'updated';
  if (existing) await existing.update({ orderId: order.id, grantedAt: new Date(), revokedAt: null }, { transaction: t });
  else await Entitlement.create({ userId: order.buyerId, patternId: order.patternId, orderId: order.id, grantedAt: new Date() }, { transaction: t });
  return 'granted';
}

async function revoke(charge: Stripe.Charge, t: Transaction): Promise<{ effect: 'revoked' | 'updated' | 'ignored'; order: Order | null }> {
  const pi = typeof charge.payment_intent === 'string' ? charge.payment_intent : charge.payment_intent?.id ?? null;
  const order = pi ? await Order.findOne({ where: { paymentIntentId: pi }, transaction: t, lock: t.LOCK.UPDATE }) : null;
  if (!order) return { effect: 'ignored', order: null };
  // A partial refund leaves the purchase standing.
  if (!charge.refunded || charge.amount_refunded < charge.amount) return { effect: 'ignored', order };
  if (order.status === 'refunded') return { effect: 'ignored', order };
  await order.update({ status: 'refunded', refundedAt: new Date() }, { transaction: t });
  const entitlement = await Entitlement.findOne({ where: { userId: order.buyerId, patternId: order.patternId, orderId: order.id }, transaction: t, lock: t.LOCK.UPDATE });
  if (!entitlement || entitlement.revokedAt) return { effect: 'updated', order };
  const other = await Order.findOne({
    where: { buyerId: order.buyerId, patternId: order.patternId, id: { [Op.ne]: order.id }, status: { [Op.in]: [...ACCESS_STATUSES] } },
    transaction: t,
  });
  if (other) { await entitlement.update({ orderId: other.id }, { transaction: t }); return { effect: 'updated', order }; }
  await entitlement.update({ revokedAt: new Date() }, { transaction: t });
  return { effect: 'revoked', order };
}

/** Mails the receipt once per order; a mail failure is logged, not fatal (the purchase stands). */
async function sendReceipt(ctx: ServerContext, orderId: number): Promise<void> {
  const order = await Order.findByPk(orderId, { include: [{ model: User, as: 'buyer' }, { model: Pattern, as: 'pattern', include: [{ model: User, as: 'owner' }] }] });
  if (!order || !order.buyer || !order.pattern || order.receiptSentAt || !order.paidAt) return;
  try {
    await ctx.mailer.send(receiptMail({
      to: order.buyer.email, name: order.buyer.name, orderId: order.id, title: order.pattern.title,
      designer: order.pattern.owner?.name ?? 'the designer', version: versionText(order),
      currency: currencyOf(order.currency), amount: order.amount, taxInclusive: order.taxInclusive, paidAt: order.paidAt,
      link: `${ctx.config.publicUrl}/patterns/${order.patternId}`,
    }));
    await order.update({ receiptSentAt: new Date() });
  } catch (err) {
    console.error(`receipt for order ${order.id} not sent:`, err instanceof Error ? err.message : err);
  }
}

/**
 * Verifies and handles one webhook delivery. `rawBody` must be the exact
 * bytes received. Throws 400 `bad-signature` when verification fails.
 */
export async function handleWebhook(ctx: ServerContext, payments: Payments | null, rawBody: Buffer, signature: string | undefined): Promise<WebhookOutcome> {
  const provider = requirePayments(payments);
  let event: Stripe.Event;
  try {
    event = provider.stripe.webhooks.constructEvent(rawBody, signature ?? '', provider.webhookSecret, provider.toleranceSeconds);
  } catch (err) {
    throw badRequest('bad-signature', `The webhook signature did not verify: ${err instanceof Error ? err.message.split('\n')[0] : 'unknown error'}`);
  }
  let receiptFor: number | null = null;
  try {
    const outcome = await ctx.sequelize.transaction(async (t) => {
      // First the event id: a second delivery fails here and changes nothing.
      const stored = await PaymentEvent.create({ id: event.id, type: event.type, orderId: null, receivedAt: new Date() }, { transaction: t });
      let effect: WebhookOutcome['effect'] = 'ignored';
      let order: Order | null = null;
      switch (event.type) {
        case 'checkout.session.completed':
        case 'checkout.session.async_payment_succeeded': {
          const session = event.data.object;
          order = await orderForSession(session, t);
          if (order && session.payment_status === 'paid') {
            effect = await grant(order, session, t);
            if (effect === 'granted') receiptFor = order.id;
          } else if (order && order.status === 'pending') {
            // Completed but not yet paid (a delayed payment method): wait for async_payment_succeeded.
            effect = 'ignored';
          }
          break;
        }
        case 'checkout.session.async_payment_failed':
        case 'checkout.session.expired': {
          order = await orderForSession(event.data.object, t);
          if (order && (order.status === 'pending' || (order.status === 'cancelled' && event.type === 'checkout.session.async_payment_failed'))) {
            await order.update({ status: event.type === 'checkout.session.expired' ? (order.status === 'cancelled' ? 'cancelled' : 'expired') : 'failed' }, { transaction: t });
            effect = 'updated';
          }
          break;
        }
        case 'charge.refunded': {
          const r = await revoke(event.data.object, t);
          order = r.order;
          effect = r.effect;
          break;
        }
        default:
          break;
      }
      if (order) await stored.update({ orderId: order.id }, { transaction: t });
      return { received: true as const, duplicate: false, type: event.type, effect };
    });
    if (receiptFor !== null) await sendReceipt(ctx, receiptFor);
    return outcome;
  } catch (err) {
    // A second delivery of a stored event; any other conflict is a real error (the provider retries).
    if (err instanceof UniqueConstraintError && (await PaymentEvent.count({ where: { id: event.id } })) > 0) {
      return { received: true, duplicate: true, type: event.type, effect: 'ignored' };
    }
    throw err;
  }
}
