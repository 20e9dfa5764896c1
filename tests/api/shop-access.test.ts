/**
 * The access policy's entitlement rule (server/services/access.ts): an
 * active entitlement makes the buyer a knitter on the pattern, who reads the
 * released revision only, and only while the pattern has a release; a
 * revoked one gives nothing; a membership role takes precedence.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Entitlement, Membership, Order, Pattern, Price, Product, User } from '../../server/models/index.ts';
import { authorizePattern, roleOn } from '../../server/services/access.ts';
import { makeUser, startHarness, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let designer: TestUser;
let buyer: TestUser;
let patternId: number;

/** An entitlement as the webhook would leave it (with the order it needs). */
async function entitle(userId: number, pid: number, revoked = false): Promise<void> {
  const product = await Product.findOne({ where: { patternId: pid } }) ?? await Product.create({ patternId: pid, active: true });
  const price = await Price.create({ productId: product.id, currency: 'EUR', unitAmount: 500, taxInclusive: true });
  const order = await Order.create({ productId: product.id, priceId: price.id, patternId: pid, buyerId: userId, revisionNumber: 1, versionLabel: null, currency: 'EUR', amount: 500, taxInclusive: true, checkoutSessionId: null, status: revoked ? 'refunded' : 'paid' });
  await Entitlement.create({ userId, patternId: pid, orderId: order.id, grantedAt: new Date(), revokedAt: revoked ? new Date() : null });
}

beforeAll(async () => {
  h = await startHarness();
  designer = await makeUser(h.app, 'acc-designer', ['designer']);
  buyer = await makeUser(h.app, 'acc-buyer', ['knitter']);
  patternId = (await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Access', source: sampleSource() })).body.pattern.id;
  await request(h.app).post(`/api/patterns/${patternId}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource('two'), baseRevision: 1, message: 'two' });
});
afterAll(async () => { await h?.close(); });

describe('entitlements in the access policy', () => {
  it('gives a buyer the knitter role: the released revision only, nothing else', async () => {
    await Pattern.update({ status: 'released', releasedRevision: 1 }, { where: { id: patternId } });
    await entitle(buyer.id, patternId);
    const user = (await User.findByPk(buyer.id))!;
    expect(await roleOn(user, (await Pattern.findByPk(patternId))!)).toBe('knitter');
    expect((await request(h.app).get(`/api/patterns/${patternId}/revisions/1`).set('Authorization', buyer.auth)).status).toBe(200);
    expect((await request(h.app).get(`/api/patterns/${patternId}/revisions/2`).set('Authorization', buyer.auth)).status).toBe(404);
    await expect(authorizePattern(user, patternId, 'save-revision')).rejects.toMatchObject({ status: 403 });
    await expect(authorizePattern(user, patternId, 'sell')).rejects.toMatchObject({ status: 403 });
  });

  it('hides the pattern again while it has no release', async () => {
    await Pattern.update({ releasedRevision: null, status: 'draft' }, { where: { id: patternId } });
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', buyer.auth)).status).toBe(404);
    await Pattern.update({ status: 'released', releasedRevision: 1 }, { where: { id: patternId } });
  });

  it('lets a membership role win over the entitlement', async () => {
    await Membership.create({ patternId, userId: buyer.id, role: 'editor' });
    const user = (await User.findByPk(buyer.id))!;
    expect(await roleOn(user, (await Pattern.findByPk(patternId))!)).toBe('editor');
    await Membership.destroy({ where: { patternId, userId: buyer.id } });
  });

  it('gives nothing for a revoked entitlement', async () => {
    const other = await makeUser(h.app, 'acc-refunded', ['knitter']);
    await entitle(other.id, patternId, true);
    const user = (await User.findByPk(other.id))!;
    expect(await roleOn(user, (await Pattern.findByPk(patternId))!)).toBeNull();
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', other.auth)).status).toBe(404);
  });
});
