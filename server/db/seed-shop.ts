/**
 * Demo shop for local runs (`npm start`), after the review seed has
 * released the Lantern Mitts: the designer's listing of that released
 * version at 6.50 EUR, tax included (integer minor units: 650), with a short
 * description. Only a pattern that really is released gets listed; nothing
 * is released here. Idempotent: an existing listing is left as it is.
 * Local demo data only.
 */
import type { Sequelize } from 'sequelize';
import { Pattern, Price, Product, User } from '../models/index.ts';
import { DEMO_RELEASED_TITLE } from './seed-review.ts';

/** The demo listing's price: 650 minor units of EUR, tax included. */
export const DEMO_LISTING = { currency: 'EUR', amount: 650, taxInclusive: true } as const;

/** Lists the released demo pattern in the shop; returns how many listings it added (0 or 1). */
export async function seedShopDemo(sequelize: Sequelize): Promise<{ listings: number }> {
  const designer = await User.findOne({ where: { email: 'designer@saltmarsh.example' } });
  const pattern = designer ? await Pattern.findOne({ where: { ownerId: designer.id, title: DEMO_RELEASED_TITLE } }) : null;
  if (!pattern || !pattern.releasedRevision) return { listings: 0 };
  if (await Product.findOne({ where: { patternId: pattern.id } })) return { listings: 0 };
  await sequelize.transaction(async (transaction) => {
    const product = await Product.create({
      patternId: pattern.id,
      active: true,
      description: 'Fingerless mitts in three sizes: a lantern motif on the back of the hand, backing stitches behind the plain areas, and a striped thumb gusset. Fingering weight, two colours.',
    }, { transaction });
    await Price.create({ productId: product.id, currency: DEMO_LISTING.currency, unitAmount: DEMO_LISTING.amount, taxInclusive: DEMO_LISTING.taxInclusive }, { transaction });
  });
  return { listings: 1 };
}
