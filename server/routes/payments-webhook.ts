/**
 * POST /api/payments/webhook: the payment provider's signed events. Mounted
 * before the JSON body parser, because the signature covers the exact bytes
 * sent (the SDK verifies the raw body). No session, no Origin check: the
 * signature is the authentication.
 */
import express, { Router } from 'express';
import type { ServerContext } from '../context.ts';
import type { Payments } from '../services/payments.ts';
import { handleWebhook } from '../services/shop-webhooks.ts';

/** The webhook route with its own raw body parser (at most 1 MiB). */
export function paymentsWebhookRoutes(ctx: ServerContext, payments: Payments | null): Router {
  const r = Router();
  r.post('/api/payments/webhook', express.raw({ type: () => true, limit: '1mb' }), async (req, res) => {
    const body = Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0);
    res.json(await handleWebhook(ctx, payments, body, req.get('stripe-signature')));
  });
  return r;
}
