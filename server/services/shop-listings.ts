/**
 * Listings: the owner of a released pattern puts it on sale with a price
 * (integer minor units, currency, tax-inclusive or not), a short
 * description and photos chosen from the pattern's uploads. The public shop
 * lists active listings of released patterns; anyone may browse, photos and
 * the coarse chart preview included. The pattern itself stays behind the
 * access policy: only buyers (entitlements) and members read it.
 */
import { Op } from 'sequelize';
import type { ApiListing, ApiListingEditor, ListingBody } from '../../shared/shop/api.ts';
import type { ServerContext } from '../context.ts';
import { Pattern, Price, Product, ProductPhoto, Revision, Upload, User } from '../models/index.ts';
import { authorizePattern, roleOn } from './access.ts';
import { badRequest, conflict, notFound } from './errors.ts';
import { chartPreviewSvg } from './shop-preview.ts';
import { activePrice, releasedVersion, toApiListing } from './shop-serialize.ts';

const withPhotos = { model: ProductPhoto, as: 'photos' } as const;

/** The listing editor's data for the owner of pattern `patternId`. */
export async function getListingEditor(ctx: ServerContext, user: User | null, patternId: number): Promise<ApiListingEditor> {
  const { pattern } = await authorizePattern(user, patternId, 'sell');
  const product = await Product.findOne({ where: { patternId: pattern.id }, include: [withPhotos] });
  const price = product ? await activePrice(product.id) : null;
  const uploads = await Upload.findAll({ where: { patternId: pattern.id, kind: 'swatch' }, order: [['id', 'DESC']] });
  return {
    listing: product && price ? await toApiListing(ctx.sequelize, product, pattern, price, { owned: true, isMine: true }) : null,
    released: await releasedVersion(ctx.sequelize, pattern),
    uploads: uploads.map((u) => ({ id: u.id, url: `/api/uploads/${u.id}`, originalName: u.originalName })),
  };
}

/**
 * Creates or updates the listing of a released pattern (owner only). A new
 * price deactivates the old one (orders keep the price they were placed at).
 * 409 `not-released` before the first release; 400 for photos that are not
 * this pattern's uploaded images.
 */
export async function saveListing(ctx: ServerContext, user: User | null, patternId: number, body: ListingBody & { photoIds: number[] }): Promise<ApiListing> {
  const { pattern } = await authorizePattern(user, patternId, 'sell');
  if (!pattern.releasedRevision) throw conflict('not-released', 'Release a revision of this pattern before putting it on sale; buyers get the released version.');
  const photoIds = [...new Set(body.photoIds)];
  if (photoIds.length) {
    const found = await Upload.count({ where: { id: { [Op.in]: photoIds }, patternId: pattern.id, kind: 'swatch' } });
    if (found !== photoIds.length) throw badRequest('invalid-photos', "Choose photos from this pattern's own uploaded images.");
  }
  const id = await ctx.sequelize.transaction(async (transaction) => {
    let product = await Product.findOne({ where: { patternId: pattern.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!product) product = await Product.create({ patternId: pattern.id, description: body.description, active: body.active }, { transaction });
    else await product.update({ description: body.description, active: body.active }, { transaction });
    const current = await Price.findOne({ where: { productId: product.id, active: true }, order: [['id', 'DESC']], transaction });
    const same = current && current.currency === body.currency && current.unitAmount === body.amount && current.taxInclusive === body.taxInclusive;
    if (!same) {
      await Price.update({ active: false }, { where: { productId: product.id, active: true }, transaction });
      await Price.create({ productId: product.id, currency: body.currency, unitAmount: body.amount, taxInclusive: body.taxInclusive }, { transaction });
    }
    await ProductPhoto.destroy({ where: { productId: product.id }, transaction });
    if (photoIds.length) await ProductPhoto.bulkCreate(photoIds.map((uploadId, position) => ({ productId: product.id, uploadId, position })), { transaction });
    return product.id;
  });
  const product = (await Product.findByPk(id, { include: [withPhotos] }))!;
  return toApiListing(ctx.sequelize, product, pattern, (await activePrice(id))!, { owned: true, isMine: true });
}

/** Whether `user` already has the pattern (bought it, owns it or is a member who can read it). */
async function callerFlags(user: User | null, pattern: Pattern): Promise<{ owned: boolean; isMine: boolean }> {
  if (!user) return { owned: false, isMine: false };
  const role = await roleOn(user, pattern);
  return { owned: role !== null, isMine: role === 'owner' };
}

/** Listings on sale now (active, pattern released), newest first. Public. */
export async function listShop(ctx: ServerContext, user: User | null): Promise<ApiListing[]> {
  const products = await Product.findAll({
    where: { active: true },
    include: [withPhotos, { model: Pattern, as: 'pattern', required: true, where: { releasedRevision: { [Op.ne]: null } }, include: [{ model: User, as: 'owner' }] }],
    order: [['updatedAt', 'DESC'], ['id', 'DESC']],
  });
  const out: ApiListing[] = [];
  for (const product of products) {
    const price = await activePrice(product.id);
    if (!price || !product.pattern) continue;
    out.push(await toApiListing(ctx.sequelize, product, product.pattern, price, await callerFlags(user, product.pattern)));
  }
  return out;
}

/**
 * A listing the caller may see: on sale, or the caller's own. Everybody
 * else gets 404 (a withdrawn listing is not leaked).
 */
export async function findVisibleListing(user: User | null, listingId: number): Promise<{ product: Product; pattern: Pattern; price: Price }> {
  const product = Number.isSafeInteger(listingId) ? await Product.findByPk(listingId, { include: [withPhotos, { model: Pattern, as: 'pattern', include: [{ model: User, as: 'owner' }] }] }) : null;
  const pattern = product?.pattern;
  const price = product ? await activePrice(product.id) : null;
  if (!product || !pattern || !price) throw notFound('That listing');
  const isMine = user !== null && pattern.ownerId === user.id;
  if (!isMine && (!product.active || !pattern.releasedRevision)) throw notFound('That listing');
  return { product, pattern, price };
}

/** One listing (public while on sale). */
export async function getListing(ctx: ServerContext, user: User | null, listingId: number): Promise<ApiListing> {
  const { product, pattern, price } = await findVisibleListing(user, listingId);
  return toApiListing(ctx.sequelize, product, pattern, price, await callerFlags(user, pattern));
}

/** The coarse chart preview of a visible listing (SVG text). */
export async function listingPreview(user: User | null, listingId: number): Promise<string> {
  const { pattern } = await findVisibleListing(user, listingId);
  if (!pattern.releasedRevision) throw notFound('That preview');
  const revision = await Revision.findOne({ where: { patternId: pattern.id, number: pattern.releasedRevision }, attributes: ['id', 'source'] });
  if (!revision) throw notFound('That preview');
  return chartPreviewSvg(`${pattern.id}:${pattern.releasedRevision}`, revision.source);
}

/** Bytes of a photo shown on a visible listing (and only those: other uploads stay private). */
export async function listingPhoto(ctx: ServerContext, user: User | null, listingId: number, uploadId: number): Promise<{ mimeType: string; data: Buffer }> {
  const { product } = await findVisibleListing(user, listingId);
  const link = (product.photos ?? []).find((p) => p.uploadId === uploadId);
  const upload = link ? await Upload.findByPk(link.uploadId) : null;
  const data = upload ? await ctx.storage.get(upload.storageKey) : null;
  if (!upload || !data) throw notFound('That photo');
  return { mimeType: upload.mimeType, data };
}
