/**
 * The designer's sales table: orders with date, buyer, version, amount and
 * status; totals per pattern, month and currency in integer minor units;
 * the CSV download read back with an independent parser (csv-parse, which
 * follows RFC 4180), including names with commas, quotes, line breaks and
 * a leading "=" (kept from running as a spreadsheet formula, per OWASP's
 * CSV injection advice).
 */
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../server/models/index.ts';
import { csvField } from '../../server/services/sales.ts';
import type { TestUser } from './helpers.ts';
import { checkout, listedPattern, makeUser, startShopHarness, type ShopHarness } from './shop-harness.ts';

let h: ShopHarness;
let designer: TestUser;
let cowl: { patternId: number; listingId: number };
let mitts: { patternId: number; listingId: number };
const TRICKY_NAME = '=Quayle, "Sorrel"\nand co';

async function buy(buyer: TestUser, listingId: number): Promise<number> {
  const { orderId, url } = await checkout(h, buyer, listingId);
  const res = await fetch(url, { method: 'POST', body: new URLSearchParams({ action: 'pay', card: '4242424242424242' }), redirect: 'manual' });
  expect(res.status).toBe(303);
  await h.fake.settle();
  return orderId;
}

beforeAll(async () => {
  h = await startShopHarness();
  designer = await makeUser(h.app, 'sales-designer', ['designer']);
  cowl = await listedPattern(h, designer, 'Sales Cowl', 650, 'EUR');
  mitts = await listedPattern(h, designer, 'Sales Mitts', 1200, 'JPY');
  const a = await makeUser(h.app, 'sales-a', ['knitter']);
  const b = await makeUser(h.app, 'sales-b', ['knitter']);
  await User.update({ name: TRICKY_NAME }, { where: { id: b.id } });
  await buy(a, cowl.listingId);
  const refunded = await buy(b, cowl.listingId);
  await buy(a, mitts.listingId);
  await checkout(h, b, mitts.listingId); // abandoned: stays pending
  await request(h.app).post(`/api/sales/orders/${refunded}/refund`).set('Authorization', designer.auth).send({});
  await h.fake.settle();
}, 90_000);
afterAll(async () => { await h?.close(); });

describe('sales table', () => {
  it('lists every order of the designer with date, buyer, version, amount and status', async () => {
    const res = await request(h.app).get('/api/sales').set('Authorization', designer.auth);
    expect(res.status).toBe(200);
    expect(res.body.orders).toHaveLength(4);
    const statuses = res.body.orders.map((o: { status: string }) => o.status).sort();
    expect(statuses).toEqual(['paid', 'paid', 'pending', 'refunded']);
    for (const o of res.body.orders) {
      expect(Number.isInteger(o.price.amount)).toBe(true);
      expect(o.version).toBe('revision 1');
      expect(o.buyer.email).toMatch(/@test\.example$/);
    }
  });

  it('totals per pattern and month count paid orders and subtract refunds (integers, per currency)', async () => {
    const res = await request(h.app).get('/api/sales').set('Authorization', designer.auth);
    const month = new Date().toISOString().slice(0, 7);
    expect(res.body.totals).toEqual(expect.arrayContaining([
      { patternId: cowl.patternId, title: 'Sales Cowl', month, currency: 'EUR', orders: 2, gross: 1300, refunded: 650, net: 650 },
      { patternId: mitts.patternId, title: 'Sales Mitts', month, currency: 'JPY', orders: 1, gross: 1200, refunded: 0, net: 1200 },
    ]));
    expect(res.body.totals).toHaveLength(2);
  });

  it('shows another designer nothing', async () => {
    const stranger = await makeUser(h.app, 'sales-stranger', ['designer']);
    const res = await request(h.app).get('/api/sales').set('Authorization', stranger.auth);
    expect(res.body).toEqual({ orders: [], totals: [] });
    expect((await request(h.app).get('/api/sales')).status).toBe(401);
  });

  it('downloads a CSV that an RFC 4180 parser reads back exactly', async () => {
    const res = await request(h.app).get('/api/sales/orders.csv').set('Authorization', designer.auth);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="loopwright-sales-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(4);
    const tricky = rows.filter((r) => r.buyer === `'${TRICKY_NAME}`);
    expect(tricky).toHaveLength(2);
    const refunded = rows.find((r) => r.status === 'refunded')!;
    expect(refunded).toMatchObject({ pattern: 'Sales Cowl', currency: 'EUR', amount: '6.50', amount_minor: '650', tax_inclusive: 'true', version: 'revision 1' });
    const yen = rows.find((r) => r.currency === 'JPY' && r.status === 'paid')!;
    expect(yen.amount).toBe('1200');
    expect(res.text.includes('\r\n')).toBe(true);
  });

  it('escapes single fields as RFC 4180 says (quotes doubled, quoted when needed)', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField('line\nbreak')).toBe('"line\nbreak"');
    expect(csvField('=SUM(A1)')).toBe("'=SUM(A1)");
    expect(csvField('-5')).toBe("'-5");
    expect(csvField(-5)).toBe('-5');
    expect(csvField(null)).toBe('');
  });
});
