/**
 * The demo shop seed: after the demo seed and the review seed (which
 * releases the Lantern Mitts as 1.0 through the release records), the
 * released pattern is on sale at 650 minor units of EUR; running it again
 * adds nothing; an unreleased demo pattern is never listed.
 */
import { Op } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../server/db/seed.ts';
import { Revision } from '../../server/models/index.ts';
import { DEMO_RELEASED_TITLE, seedReviewDemo } from '../../server/db/seed-review.ts';
import { DEMO_LISTING, seedShopDemo } from '../../server/db/seed-shop.ts';
import { startHarness, type ApiHarness } from './helpers.ts';

let h: ApiHarness;
beforeAll(async () => {
  h = await startHarness();
  await seedDemo(h.sequelize);
  await seedReviewDemo(h.sequelize);
}, 60_000);
afterAll(async () => { await h?.close(); });

describe('demo shop seed', () => {
  it('lists the released demo pattern once, at an integer price, with its release label', async () => {
    await seedShopDemo(h.sequelize);
    expect(await seedShopDemo(h.sequelize)).toEqual({ listings: 0 });
    const res = await request(h.app).get('/api/shop');
    const mitts = res.body.listings.filter((l: { title: string; designer: { name: string } }) => l.title === DEMO_RELEASED_TITLE && l.designer.name === 'Maren Tolley');
    expect(mitts).toHaveLength(1);
    expect(mitts[0].price).toEqual(DEMO_LISTING);
    expect(mitts[0].version).toEqual({ revision: 1, label: '1.0' });
    // The other demo patterns (from examples/, not released) are not on sale.
    const demo = await Revision.findAll({ where: { number: 1, message: { [Op.startsWith]: 'Demo pattern from examples/' } }, attributes: ['patternId'] });
    const others = new Set(demo.map((r) => r.patternId).filter((id) => id !== mitts[0].patternId));
    expect(others.size).toBeGreaterThan(0);
    expect(res.body.listings.filter((l: { patternId: number }) => others.has(l.patternId))).toEqual([]);
  });
});
