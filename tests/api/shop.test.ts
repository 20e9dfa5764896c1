/**
 * The shop against a real MariaDB and the local payment stand-in, through
 * the official SDK: listing a released pattern, the public shop with its
 * coarse preview, checkout, payment on the stand-in's page, the signed
 * `checkout.session.completed` webhook granting access exactly once, the
 * receipt over SMTP, failed and abandoned payments granting nothing,
 * replayed and badly signed webhooks refused, refunds revoking access,
 * and an erratum release reaching the buyer at no charge.
 *
 * Signature scheme (the provider's published webhook docs, and the SDK's
 * own `generateTestHeaderString` used below as the independent signer):
 * `t=<unix seconds>,v1=<hex HMAC-SHA256(secret, t + "." + raw body)>`,
 * refused when older than the tolerance (300 s by default).
 */
import Stripe from 'stripe';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Entitlement, Order, Pattern, PaymentEvent, Revision } from '../../server/models/index.ts';
import { PASSWORD } from './helpers.ts';
import { pngBytes } from './images.ts';
import { sampleSource } from './sample-source.ts';
import { checkout, listedPattern, makeUser, startShopHarness, type ShopHarness } from './shop-harness.ts';
import type { TestUser } from './helpers.ts';

let h: ShopHarness;
let designer: TestUser;
let buyer: TestUser;
let other: TestUser;
let patternId: number;
let listingId: number;

beforeAll(async () => {
  h = await startShopHarness();
  designer = await makeUser(h.app, 'shop-designer', ['designer']);
  buyer = await makeUser(h.app, 'shop-buyer', ['knitter']);
  other = await makeUser(h.app, 'shop-other', ['knitter']);
  ({ patternId, listingId } = await listedPattern(h, designer, 'Tidepool Cowl (shop test)'));
}, 60_000);
afterAll(async () => { await h?.close(); });

const payOnPage = (url: string, card = '4242 4242 4242 4242') =>
  fetch(url, { method: 'POST', body: new URLSearchParams({ action: 'pay', card }), redirect: 'manual' });
const entitlements = (userId: number, pid: number) => Entitlement.count({ where: { userId, patternId: pid, revokedAt: null } });
const sdk = new Stripe('sk_test_unused_for_signing');

describe('listings', () => {
  it('refuses a listing before the pattern is released (409) and to anyone but the owner (404)', async () => {
    const draft = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Draft only', source: sampleSource() });
    const body = { currency: 'EUR', amount: 500, taxInclusive: true, description: '', photoIds: [], active: true };
    const early = await request(h.app).put(`/api/patterns/${draft.body.pattern.id}/listing`).set('Authorization', designer.auth).send(body);
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('not-released');
    expect((await request(h.app).put(`/api/patterns/${patternId}/listing`).set('Authorization', other.auth).send(body)).status).toBe(404);
  });

  it.each([
    ['a fractional amount', { amount: 6.5 }],
    ['an amount as text', { amount: '650' }],
    ['a negative amount', { amount: -650 }],
    ['an unknown currency', { currency: 'XYZ' }],
    ['a missing tax flag', { taxInclusive: undefined }],
  ])('answers 400 for %s (money is an integer of minor units)', async (_label, change) => {
    const res = await request(h.app).put(`/api/patterns/${patternId}/listing`).set('Authorization', designer.auth)
      .send({ currency: 'EUR', amount: 650, taxInclusive: true, description: 'x', photoIds: [], active: true, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid-request');
  });

  it('lists the pattern publicly without the source, with an integer price and a coarse preview', async () => {
    const res = await request(h.app).get('/api/shop');
    expect(res.status).toBe(200);
    const listing = res.body.listings.find((l: { id: number }) => l.id === listingId);
    expect(listing).toMatchObject({ patternId, price: { currency: 'EUR', amount: 650, taxInclusive: true }, version: { revision: 1 }, owned: false });
    expect(Number.isInteger(listing.price.amount)).toBe(true);
    const source = sampleSource();
    const firstRound = source.split('\n').find((l) => /^\s*(round|rounds|row|rows)\b/.test(l)) ?? source.split('\n')[0]!;
    expect(JSON.stringify(res.body)).not.toContain(firstRound.trim());
    const svg = await request(h.app).get(listing.previewUrl).buffer(true).parse((r, cb) => { let t = ''; r.on('data', (c: Buffer) => { t += c.toString(); }); r.on('end', () => cb(null, t)); });
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    const text = svg.body as string;
    expect(text).not.toMatch(/<text|<script|<title/);
    expect(text).not.toContain(firstRound.trim());
    // At most 24 x 24 colour blocks plus the background.
    expect((text.match(/<rect/g) ?? []).length).toBeLessThanOrEqual(24 * 24 + 1);
  });

  it('shows chosen photos to anyone, keeps other uploads private, refuses photos of another pattern', async () => {
    const upload = (pid: number) => request(h.app).post(`/api/patterns/${pid}/uploads`).set('Authorization', designer.auth).attach('file', pngBytes(), { filename: 'swatch.png', contentType: 'image/png' });
    const shown = (await upload(patternId)).body.upload.id as number;
    const hidden = (await upload(patternId)).body.upload.id as number;
    const elsewhere = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Elsewhere', source: sampleSource() });
    const foreign = (await upload(elsewhere.body.pattern.id)).body.upload.id as number;
    const body = { currency: 'EUR', amount: 650, taxInclusive: true, description: `Tidepool Cowl (shop test): a test listing`, active: true };
    const bad = await request(h.app).put(`/api/patterns/${patternId}/listing`).set('Authorization', designer.auth).send({ ...body, photoIds: [shown, foreign] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid-photos');
    const ok = await request(h.app).put(`/api/patterns/${patternId}/listing`).set('Authorization', designer.auth).send({ ...body, photoIds: [shown] });
    expect(ok.body.listing.photos).toEqual([{ id: shown, url: `/api/shop/listings/${listingId}/photos/${shown}` }]);
    const photo = await request(h.app).get(`/api/shop/listings/${listingId}/photos/${shown}`);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/png');
    expect((await request(h.app).get(`/api/shop/listings/${listingId}/photos/${hidden}`)).status).toBe(404);
    expect((await request(h.app).get(`/api/uploads/${shown}`)).status).toBe(401);
  });

  it('does not open the pattern itself to shoppers (404 for a knitter who has not bought it)', async () => {
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', other.auth)).status).toBe(404);
  });
});

describe('checkout and the webhook', () => {
  let orderId: number;
  let sessionId: string;

  it('needs a signed-in buyer, refuses the designer buying their own pattern', async () => {
    expect((await request(h.app).post(`/api/shop/listings/${listingId}/checkout`).send({})).status).toBe(401);
    const own = await request(h.app).post(`/api/shop/listings/${listingId}/checkout`).set('Authorization', designer.auth).send({});
    expect(own.status).toBe(400);
    expect(own.body.error.code).toBe('own-pattern');
  });

  it('grants access once the stand-in reports the payment, and mails a receipt', async () => {
    h.smtp.clear();
    let url: string;
    ({ orderId, sessionId, url } = await checkout(h, buyer, listingId));
    expect(sessionId).toMatch(/^cs_test_/);
    expect((await Order.findByPk(orderId))!.status).toBe('pending');
    expect(await entitlements(buyer.id, patternId)).toBe(0);

    const paid = await payOnPage(url);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://loopwright.test/shop/thanks?order=${orderId}&session=${sessionId}`);
    await h.fake.settle();

    const order = (await Order.findByPk(orderId))!;
    expect(order.status).toBe('paid');
    expect(order.paymentIntentId).toMatch(/^pi_/);
    expect(await entitlements(buyer.id, patternId)).toBe(1);
    const opened = await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', buyer.auth);
    expect(opened.status).toBe(200);
    expect(opened.body.latestRevision.number).toBe(1);
    const library = await request(h.app).get('/api/patterns').set('Authorization', buyer.auth);
    expect(library.body.patterns).toEqual(expect.arrayContaining([expect.objectContaining({ id: patternId, myRole: 'knitter' })]));

    const receipt = await h.smtp.waitFor(buyer.email);
    expect(receipt.subject).toContain('Tidepool Cowl (shop test)');
    expect(receipt.text).toContain('€6.50');
    expect(receipt.text).toContain(`/patterns/${patternId}`);
    const own = await request(h.app).get(`/api/shop/orders/${orderId}`).set('Authorization', buyer.auth);
    expect(own.body.order).toMatchObject({ status: 'paid', price: { amount: 650, currency: 'EUR' } });
    expect((await request(h.app).get(`/api/shop/orders/${orderId}`).set('Authorization', other.auth)).status).toBe(404);
  });

  it('handles a second delivery of the same event once (200, no second grant, no second receipt)', async () => {
    const completed = [...h.fake.store.events.values()].find((e) => e.event.type === 'checkout.session.completed' && (e.event.data.object as { id: string }).id === sessionId)!;
    expect(await h.fake.resend(completed.event.id)).toBe(200);
    // And two deliveries at the same moment.
    const header = sdk.webhooks.generateTestHeaderString({ payload: completed.payload, secret: h.fake.webhookSecret });
    const both = await Promise.all([0, 1].map(() => request(h.app).post('/api/payments/webhook').set('Stripe-Signature', header).set('Content-Type', 'application/json').send(completed.payload)));
    expect(both.map((r) => r.status)).toEqual([200, 200]);
    expect(both.every((r) => r.body.duplicate === true)).toBe(true);
    expect(await Entitlement.count({ where: { userId: buyer.id, patternId } })).toBe(1);
    expect(await PaymentEvent.count({ where: { id: completed.event.id } })).toBe(1);
    await new Promise((r) => setTimeout(r, 300));
    expect(h.smtp.list().filter((m) => m.to.includes(buyer.email) && m.subject.startsWith('Your receipt')).length).toBe(1);
  });

  it('refuses a second purchase of a pattern the buyer has (409)', async () => {
    const again = await request(h.app).post(`/api/shop/listings/${listingId}/checkout`).set('Authorization', buyer.auth).send({});
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already-owned');
  });

  it('gives the buyer a later release (an erratum) at no charge', async () => {
    await Revision.create({ patternId, number: 2, source: sampleSource('erratum'), authorId: designer.id, message: 'Erratum', summary: null, errors: 0, warnings: 0 });
    await Pattern.update({ latestRevision: 2, releasedRevision: 2, approvedRevision: 2 }, { where: { id: patternId } });
    const opened = await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', buyer.auth);
    expect(opened.status).toBe(200);
    expect(opened.body.latestRevision.number).toBe(2);
    expect(await Order.count({ where: { buyerId: buyer.id, patternId } })).toBe(1);
  });
});

describe('webhooks that must change nothing', () => {
  let pending: { orderId: number; sessionId: string; url: string };
  let forged: string;
  beforeAll(async () => {
    const knitter = await makeUser(h.app, 'shop-forger', ['knitter']);
    pending = await checkout(h, knitter, listingId);
    // What the provider would send after a payment that never happened.
    const session = { ...(await h.fake.store.sessions.get(pending.sessionId)!), status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' };
    const { line_items_data: _items, ...sessionJson } = session;
    forged = JSON.stringify({ id: 'evt_forged_1', object: 'event', type: 'checkout.session.completed', created: Math.floor(Date.now() / 1000), data: { object: sessionJson } });
  });

  const send = (payload: string, header?: string) => {
    const req = request(h.app).post('/api/payments/webhook').set('Content-Type', 'application/json');
    return (header === undefined ? req : req.set('Stripe-Signature', header)).send(payload);
  };
  const stillPending = async () => {
    expect((await Order.findByPk(pending.orderId))!.status).toBe('pending');
    expect(await PaymentEvent.count({ where: { id: 'evt_forged_1' } })).toBe(0);
  };

  it('refuses a missing signature (400)', async () => {
    const res = await send(forged);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad-signature');
    await stillPending();
  });

  it('refuses a signature made with another secret (400)', async () => {
    const res = await send(forged, sdk.webhooks.generateTestHeaderString({ payload: forged, secret: 'whsec_someone_else' }));
    expect(res.status).toBe(400);
    await stillPending();
  });

  it('refuses a replay signed long ago (older than the 300 s tolerance)', async () => {
    const old = Math.floor(Date.now() / 1000) - 3600;
    const res = await send(forged, sdk.webhooks.generateTestHeaderString({ payload: forged, secret: h.fake.webhookSecret, timestamp: old }));
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/tolerance/i);
    await stillPending();
  });

  it('refuses a body changed after signing (the signature covers the raw bytes)', async () => {
    const header = sdk.webhooks.generateTestHeaderString({ payload: forged, secret: h.fake.webhookSecret });
    const res = await send(forged.replace('"amount_total":650', '"amount_total":1').replace('evt_forged_1', 'evt_forged_2'), header);
    expect(res.status).toBe(400);
    // Re-serialised JSON (same content, other bytes) fails too.
    const reformatted = JSON.stringify(JSON.parse(forged), null, 1);
    expect((await send(reformatted, header)).status).toBe(400);
    await stillPending();
  });

  it('grants nothing for a declined card (the session stays open, the order pending)', async () => {
    const res = await payOnPage(pending.url, '4000 0000 0000 0002');
    expect(res.status).toBe(402);
    expect(await res.text()).toContain('declined');
    await h.fake.settle();
    await stillPending();
  });

  it('grants nothing when the buyer cancels: the session is expired and cannot be paid later', async () => {
    const cancel = await fetch(pending.url, { method: 'POST', body: new URLSearchParams({ action: 'cancel' }), redirect: 'manual' });
    expect(cancel.status).toBe(303);
    expect(cancel.headers.get('location')).toBe(`http://loopwright.test/shop/${listingId}?cancelled=${pending.orderId}`);
    const order = (await Order.findByPk(pending.orderId))!;
    const buyerOfOrder = await makeUserToken(order.buyerId);
    const res = await request(h.app).post(`/api/shop/orders/${pending.orderId}/cancel`).set('Authorization', buyerOfOrder).send({});
    expect(res.status).toBe(200);
    expect(res.body.order.status).toBe('cancelled');
    await h.fake.settle();
    expect((await payOnPage(pending.url)).status).toBe(409);
    expect(await Entitlement.count({ where: { userId: order.buyerId, patternId } })).toBe(0);
    expect((await Order.findByPk(pending.orderId))!.status).toBe('cancelled');
  });
});

/** A Bearer header for an existing test user (signs in with the shared test password). */
async function makeUserToken(userId: number): Promise<string> {
  const { User } = await import('../../server/models/index.ts');
  const u = (await User.findByPk(userId))!;
  const login = await request(h.app).post('/api/auth/login').send({ email: u.email, password: PASSWORD });
  return `Bearer ${login.body.token}`;
}

describe('refunds', () => {
  it('a refund from the designer goes through the provider; its charge.refunded webhook revokes access', async () => {
    const knitter = await makeUser(h.app, 'shop-refund', ['knitter']);
    const { orderId, url } = await checkout(h, knitter, listingId);
    await payOnPage(url);
    await h.fake.settle();
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', knitter.auth)).status).toBe(200);

    expect((await request(h.app).post(`/api/sales/orders/${orderId}/refund`).set('Authorization', other.auth).send({})).status).toBe(404);
    const refund = await request(h.app).post(`/api/sales/orders/${orderId}/refund`).set('Authorization', designer.auth).send({});
    expect(refund.status).toBe(200);
    expect(['refund-pending', 'refunded']).toContain(refund.body.order.status);
    await h.fake.settle();

    const order = (await Order.findByPk(orderId))!;
    expect(order.status).toBe('refunded');
    expect(order.refundId).toMatch(/^re_/);
    expect(await entitlements(knitter.id, patternId)).toBe(0);
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', knitter.auth)).status).toBe(404);
    const library = await request(h.app).get('/api/patterns').set('Authorization', knitter.auth);
    expect(library.body.patterns.map((p: { id: number }) => p.id)).not.toContain(patternId);
    const again = await request(h.app).post(`/api/sales/orders/${orderId}/refund`).set('Authorization', designer.auth).send({});
    expect(again.status).toBe(409);
  });
});
