/**
 * Shop test set-up: the API harness (real MariaDB, fake SMTP) plus the
 * local payment stand-in on a free port, and the app listening on loopback
 * so the stand-in can deliver its signed webhooks to it. The app talks to
 * the stand-in through the official SDK (host/port/protocol options).
 * Also helpers to arrange a released, listed pattern.
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { startFakePayments, type FakePayments } from '../../server/fakes/payments.ts';
import { Pattern } from '../../server/models/index.ts';
import { buildApp, makeUser, startHarness, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

/** The API harness plus the payment stand-in and a listening app. */
export interface ShopHarness extends ApiHarness { fake: FakePayments; baseUrl: string }

/** Starts everything; `close()` stops it all. */
export async function startShopHarness(): Promise<ShopHarness> {
  const fake = await startFakePayments({ port: 0, retryDelaysMs: [50, 100] });
  const base = await startHarness();
  const app = buildApp(base, { payments: { secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port, protocol: 'http' } });
  const server: Server = await new Promise((resolve) => { const s = app.listen(0, '127.0.0.1', () => resolve(s)); });
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhookUrl(`${baseUrl}/api/payments/webhook`);
  return {
    ...base, app, fake, baseUrl,
    async close() {
      await fake.close();
      await new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); });
      await base.close();
    },
  };
}

/**
 * A pattern of `designer` with revision 1 released (set directly: the
 * release workflow has its own tests) and listed at `amount` minor units.
 */
export async function listedPattern(h: ShopHarness, designer: TestUser, title: string, amount = 650, currency = 'EUR'): Promise<{ patternId: number; listingId: number }> {
  const created = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title, source: sampleSource() });
  if (created.status !== 201) throw new Error(`create failed: ${created.status}`);
  const patternId = created.body.pattern.id as number;
  await Pattern.update({ status: 'released', releasedRevision: 1, approvedRevision: 1 }, { where: { id: patternId } });
  const listed = await request(h.app).put(`/api/patterns/${patternId}/listing`).set('Authorization', designer.auth)
    .send({ currency, amount, taxInclusive: true, description: `${title}: a test listing`, photoIds: [], active: true });
  if (listed.status !== 200) throw new Error(`listing failed: ${listed.status} ${JSON.stringify(listed.body)}`);
  return { patternId, listingId: listed.body.listing.id as number };
}

/** Starts a checkout as `buyer`; returns the order id and the stand-in's session id. */
export async function checkout(h: ShopHarness, buyer: TestUser, listingId: number): Promise<{ orderId: number; sessionId: string; url: string }> {
  const res = await request(h.app).post(`/api/shop/listings/${listingId}/checkout`).set('Authorization', buyer.auth).send({});
  if (res.status !== 201) throw new Error(`checkout failed: ${res.status} ${JSON.stringify(res.body)}`);
  const url = res.body.url as string;
  return { orderId: res.body.order.id, sessionId: url.split('/pay/')[1]!, url };
}

export { makeUser };
