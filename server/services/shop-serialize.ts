/** Shop rows as the API sends them, and the lookups they need (release labels, sizes). */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ApiListing, ApiOrder, ApiVersion, OrderStatusName } from '../../shared/shop/api.ts';
import { isCurrency, type CurrencyCode } from '../../shared/shop/money.ts';
import { Order, Pattern, Price, Product, ProductPhoto, Revision, User } from '../models/index.ts';

/** A currency code from the database, checked (rows are written only through validated paths). */
export function currencyOf(code: string): CurrencyCode {
  const c = code.toUpperCase();
  if (!isCurrency(c)) throw new Error(`unknown currency in the database: ${code}`);
  return c;
}

/**
 * The label of the release of `revision`, or null. Release labels belong to
 * the review-and-release work (table `releases`); read by SQL so the shop
 * does not depend on that model, and a missing table means "no labels".
 */
export async function releaseLabel(sequelize: Sequelize, patternId: number, revision: number): Promise<string | null> {
  try {
    const rows = await sequelize.query<{ label: string }>('SELECT label FROM releases WHERE patternId = ? AND revisionNumber = ? LIMIT 1', {
      replacements: [patternId, revision], type: QueryTypes.SELECT,
    });
    return rows[0]?.label ?? null;
  } catch {
    return null;
  }
}

/** The version text of an order: its release label, else "revision N". */
export const versionText = (o: Pick<Order, 'versionLabel' | 'revisionNumber'>) => o.versionLabel ?? `revision ${o.revisionNumber}`;

/** The released version of a pattern (null when not released). */
export async function releasedVersion(sequelize: Sequelize, pattern: Pattern): Promise<ApiVersion | null> {
  if (!pattern.releasedRevision) return null;
  return { revision: pattern.releasedRevision, label: await releaseLabel(sequelize, pattern.id, pattern.releasedRevision) };
}

/** Size names of the released revision, from its stored compile summary. */
export async function releasedSizes(pattern: Pattern): Promise<string[]> {
  if (!pattern.releasedRevision) return [];
  const r = await Revision.findOne({ where: { patternId: pattern.id, number: pattern.releasedRevision }, attributes: ['id', 'summary'] });
  return r?.summary?.sizes.map((s) => s.name) ?? [];
}

/** The active price of a product (the newest active row). */
export async function activePrice(productId: number): Promise<Price | null> {
  return Price.findOne({ where: { productId, active: true }, order: [['id', 'DESC']] });
}

/** A listing for the API. `owned`/`isMine` describe the caller. */
export async function toApiListing(sequelize: Sequelize, product: Product, pattern: Pattern, price: Price, flags: { owned: boolean; isMine: boolean }): Promise<ApiListing> {
  const designer = pattern.owner ?? (await User.findByPk(pattern.ownerId));
  const photos = product.photos ?? (await ProductPhoto.findAll({ where: { productId: product.id } }));
  const version = (await releasedVersion(sequelize, pattern)) ?? { revision: 0, label: null };
  return {
    id: product.id,
    patternId: pattern.id,
    title: pattern.title,
    designer: { id: designer?.id ?? 0, name: designer?.name ?? 'unknown' },
    description: product.description,
    price: { currency: currencyOf(price.currency), amount: price.unitAmount, taxInclusive: price.taxInclusive },
    active: product.active,
    version,
    sizes: await releasedSizes(pattern),
    photos: [...photos].sort((a, b) => a.position - b.position).map((p) => ({ id: p.uploadId, url: `/api/shop/listings/${product.id}/photos/${p.uploadId}` })),
    previewUrl: `/api/shop/listings/${product.id}/preview.svg?v=${version.revision}`,
    owned: flags.owned,
    isMine: flags.isMine,
    updatedAt: product.updatedAt.toISOString(),
  };
}

/** An order for the API; `buyer` is included for the designer's sales table. */
export function toApiOrder(o: Order, title: string, buyer: User | null): ApiOrder {
  return {
    id: o.id,
    listingId: o.productId,
    patternId: o.patternId,
    title,
    status: o.status as OrderStatusName,
    price: { currency: currencyOf(o.currency), amount: o.amount, taxInclusive: o.taxInclusive },
    version: versionText(o),
    buyer: buyer ? { id: buyer.id, name: buyer.name, email: buyer.email } : null,
    createdAt: o.createdAt.toISOString(),
    paidAt: o.paidAt?.toISOString() ?? null,
    refundedAt: o.refundedAt?.toISOString() ?? null,
  };
}
