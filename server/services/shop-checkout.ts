/**
 * Checkout: a signed-in knitter buys a listing. The server records a
 * pending order at the listing's current price, asks the payment provider
 * (through its SDK) for a checkout session, and sends the buyer to the
 * provider's payment page. Nothing is granted here: access comes only from
 * the provider's signed `checkout.session.completed` webhook (see
 * shop-webhooks.ts). Leaving the page, a declined card or an expired
 * session grant nothing.
 */
import type { ApiCheckout, ApiOrder } from '../../shared/shop/api.ts';
import type { ServerContext } from '../context.ts';
import { Order, Pattern, type User } from '../models/index.ts';
import { hasEntitlement, requireUser } from './access.ts';
import { AppError, badRequest, conflict, notFound } from './errors.ts';
import type { Payments } from './payments.ts';
import { findVisibleListing } from './shop-listings.ts';
import { releaseLabel, toApiOrder } from './shop-serialize.ts';

/** 503 when the server has no payment provider configured. */
export function requirePayments(payments: Payments | null): Payments {
  if (!payments) throw new AppError(503, 'payments-unavailable', 'Payments are not set up on this server (no STRIPE_SECRET_KEY / STRIPE_WEBHOOK_SECRET).');
  return payments;
}

/** Starts a checkout for listing `listingId`; returns the pending order and the payment page URL. */
export async function startCheckout(ctx: ServerContext, payments: Payments | null, user: User | null, listingId: number): Promise<ApiCheckout> {
  const buyer = requireUser(user);
  const provider = requirePayments(payments);
  const { product, pattern, price } = await findVisibleListing(buyer, listingId);
  if (pattern.ownerId === buyer.id) throw badRequest('own-pattern', 'This is your own pattern; there is nothing to buy.');
  if (!product.active || !pattern.releasedRevision) throw notFound('That listing');
  if (await hasEntitlement(buyer.id, pattern.id)) throw conflict('already-owned', 'You already have this pattern; it is in your library.');

  const order = await Order.create({
    productId: product.id, priceId: price.id, patternId: pattern.id, buyerId: buyer.id,
    revisionNumber: pattern.releasedRevision, versionLabel: await releaseLabel(ctx.sequelize, pattern.id, pattern.releasedRevision),
    currency: price.currency, amount: price.unitAmount, taxInclusive: price.taxInclusive, checkoutSessionId: null,
  });
  const base = ctx.config.publicUrl;
  let session;
  try {
    session = await provider.stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{
        quantity: 1,
        price_data: {
          currency: price.currency.toLowerCase(),
          unit_amount: price.unitAmount,
          tax_behavior: price.taxInclusive ? 'inclusive' : 'exclusive',
          product_data: { name: pattern.title, ...(product.description ? { description: product.description.slice(0, 500) } : {}) },
        },
      }],
      customer_email: buyer.email,
      client_reference_id: String(order.id),
      metadata: { orderId: String(order.id), patternId: String(pattern.id), buyerId: String(buyer.id) },
      success_url: `${base}/shop/thanks?order=${order.id}&session={CHECKOUT_SESSION_ID}`,
      cancel_url: `${base}/shop/${product.id}?cancelled=${order.id}`,
    }, { idempotencyKey: `loopwright-order-${order.id}` });
  } catch (err) {
    await order.update({ status: 'failed' });
    console.error('checkout session failed:', err instanceof Error ? err.message : err);
    throw new AppError(502, 'payment-provider-error', 'The payment provider could not start the payment. Nothing was charged; try again in a moment.');
  }
  if (!session.url) throw new AppError(502, 'payment-provider-error', 'The payment provider gave no payment page. Nothing was charged.');
  await order.update({ checkoutSessionId: session.id });
  return { order: toApiOrder(order, pattern.title, null), url: session.url };
}

/** The buyer's own order (for the page they return to after paying). 404 for anyone else. */
export async function getOwnOrder(user: User | null, orderId: number): Promise<ApiOrder> {
  const buyer = requireUser(user);
  const order = Number.isSafeInteger(orderId) ? await Order.findByPk(orderId, { include: [{ model: Pattern, as: 'pattern' }] }) : null;
  if (!order || order.buyerId !== buyer.id) throw notFound('That order');
  return toApiOrder(order, order.pattern?.title ?? '', null);
}

/**
 * The buyer left the payment page: expire the provider's session so it can
 * no longer be paid, and mark the order cancelled. A session that was paid
 * meanwhile is left alone (the webhook decides).
 */
export async function cancelOwnOrder(payments: Payments | null, user: User | null, orderId: number): Promise<ApiOrder> {
  const buyer = requireUser(user);
  const order = Number.isSafeInteger(orderId) ? await Order.findByPk(orderId, { include: [{ model: Pattern, as: 'pattern' }] }) : null;
  if (!order || order.buyerId !== buyer.id) throw notFound('That order');
  if (order.status === 'pending' && order.checkoutSessionId) {
    const provider = requirePayments(payments);
    try {
      const session = await provider.stripe.checkout.sessions.expire(order.checkoutSessionId);
      if (session.status === 'expired') await order.update({ status: 'cancelled' });
    } catch (err) {
      // Already complete or expired at the provider: the webhook has the last word.
      console.warn('expire failed:', err instanceof Error ? err.message : err);
    }
  }
  await order.reload();
  return toApiOrder(order, order.pattern?.title ?? '', null);
}
