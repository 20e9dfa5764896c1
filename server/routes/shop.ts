/**
 * Shop routes: the public shop (GET /api/shop, listing, photos, coarse
 * preview), the owner's listing editor, checkout and the buyer's orders,
 * and the designer's sales table (JSON and CSV) with refunds.
 */
import { Router } from 'express';
import { listingBody } from '../../shared/shop/api.ts';
import type { ServerContext } from '../context.ts';
import { requireUser } from '../services/access.ts';
import type { Payments } from '../services/payments.ts';
import { listSales, refundOrder, salesCsv } from '../services/sales.ts';
import { cancelOwnOrder, getOwnOrder, startCheckout } from '../services/shop-checkout.ts';
import { getListing, getListingEditor, listingPhoto, listingPreview, listShop, saveListing } from '../services/shop-listings.ts';
import { intParam, parseBody } from './params.ts';

/** Every shop route except the webhook (which needs the raw body; see payments-webhook.ts). */
export function shopRoutes(ctx: ServerContext, payments: Payments | null): Router {
  const r = Router();

  r.get('/shop', async (req, res) => {
    res.json({ listings: await listShop(ctx, req.user), payments: payments !== null });
  });

  r.get('/shop/listings/:id', async (req, res) => {
    res.json({ listing: await getListing(ctx, req.user, intParam(req.params.id)) });
  });

  r.get('/shop/listings/:id/preview.svg', async (req, res) => {
    const svg = await listingPreview(req.user, intParam(req.params.id));
    res.setHeader('Content-Type', 'image/svg+xml; charset=utf-8');
    res.setHeader('Cache-Control', 'public, max-age=300');
    // An SVG opened on its own must not run anything.
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'");
    res.send(svg);
  });

  r.get('/shop/listings/:id/photos/:uploadId', async (req, res) => {
    const { mimeType, data } = await listingPhoto(ctx, req.user, intParam(req.params.id), intParam(req.params.uploadId));
    res.setHeader('Content-Type', mimeType);
    res.setHeader('Content-Length', String(data.length));
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.end(data);
  });

  r.post('/shop/listings/:id/checkout', async (req, res) => {
    requireUser(req.user);
    res.status(201).json(await startCheckout(ctx, payments, req.user, intParam(req.params.id)));
  });

  r.get('/shop/orders/:id', async (req, res) => {
    res.json({ order: await getOwnOrder(req.user, intParam(req.params.id)) });
  });

  r.post('/shop/orders/:id/cancel', async (req, res) => {
    res.json({ order: await cancelOwnOrder(payments, req.user, intParam(req.params.id)) });
  });

  r.get('/patterns/:id/listing', async (req, res) => {
    res.json(await getListingEditor(ctx, req.user, intParam(req.params.id)));
  });

  r.put('/patterns/:id/listing', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(listingBody, req.body);
    res.json({ listing: await saveListing(ctx, req.user, intParam(req.params.id), body) });
  });

  r.get('/sales', async (req, res) => {
    res.json(await listSales(req.user));
  });

  r.get('/sales/orders.csv', async (req, res) => {
    const { orders } = await listSales(req.user);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8; header=present');
    res.setHeader('Content-Disposition', `attachment; filename="loopwright-sales-${new Date().toISOString().slice(0, 10)}.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    res.send(salesCsv(orders));
  });

  r.post('/sales/orders/:id/refund', async (req, res) => {
    res.json({ order: await refundOrder(payments, req.user, intParam(req.params.id)) });
  });

  return r;
}
