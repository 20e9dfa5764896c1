/**
 * A local stand-in for the payment provider, for `npm start` and the tests:
 * an HTTP server on 127.0.0.1 that answers the few API calls the app makes
 * through the provider's official SDK (create and expire a checkout
 * session, read one, create a refund) with the request and response shapes
 * the SDK expects (form-encoded bodies, JSON objects with `object` fields,
 * `{error:{type,message,param?,code?}}` failures, Bearer key, idempotency
 * keys), a hosted-page stand-in with Pay and Cancel, and webhooks signed
 * the way the SDK verifies them.
 *
 * Webhooks: `checkout.session.completed` after Pay, `checkout.session.expired`
 * after an expire call, `charge.refunded` after a refund. Each is POSTed to
 * `webhookUrl` as JSON with a `Stripe-Signature` header; failed deliveries
 * are retried a few times (200 ms, 1 s, 3 s).
 */
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import { hostedPageHtml } from './payments/hosted-page.ts';
import { newId, newSecret } from './payments/ids.ts';
import { signPayload } from './payments/signature.ts';
import {
  createStore, nowSeconds, publicSession,
  type FakeCharge, type FakeCheckoutSession, type FakeDelivery, type FakeEvent, type FakeLineItem, type FakePaymentIntent, type FakeRefund, type FakeStore,
} from './payments/state.ts';

/** Options of {@link startFakePayments}. Keys are generated when not given (never real ones). */
export interface FakePaymentsOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** Where webhooks go (the app's `/api/payments/webhook`); can be set later with `setWebhookUrl`. */
  webhookUrl?: string | null;
  secretKey?: string;
  webhookSecret?: string;
  /** Retry delays after a failed delivery, in ms (default 200, 1000, 3000). */
  retryDelaysMs?: number[];
}

/** A running fake. */
export interface FakePayments {
  host: string;
  port: number;
  /** `http://127.0.0.1:<port>` (the hosted pages live under `/pay/<session id>`). */
  url: string;
  /** The API key the app must send (Bearer). */
  secretKey: string;
  /** The endpoint secret webhooks are signed with. */
  webhookSecret: string;
  store: FakeStore;
  setWebhookUrl(url: string | null): void;
  /** Pays an open session as the Pay button does (card 4242...), then delivers the webhook; resolves with the redirect URL. */
  pay(sessionId: string): Promise<string>;
  /** Sends an earlier event again, signed anew (as the provider's "resend" does); resolves with the HTTP status. */
  resend(eventId: string): Promise<number | null>;
  /** Resolves once every delivery started so far has finished (success or retries exhausted). */
  settle(): Promise<void>;
  close(): Promise<void>;
}

/** An API error in the provider's shape. */
class FakeApiError extends Error {
  constructor(readonly status: number, message: string, readonly param?: string, readonly code?: string, readonly type = 'invalid_request_error') {
    super(message);
  }
}

const DECLINED_CARD = '4000000000000002';
const SESSION_LIFETIME_SECONDS = 24 * 3600;

const str = (v: unknown): string | null => (typeof v === 'string' ? v : null);
const record = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {});
const metadataOf = (v: unknown): Record<string, string> =>
  Object.fromEntries(Object.entries(record(v)).filter((e): e is [string, string] => typeof e[1] === 'string'));

function positiveInt(v: unknown, param: string, min = 0): number {
  const s = str(v);
  if (s === null) throw new FakeApiError(400, `Missing required param: ${param}.`, param, 'parameter_missing');
  if (!/^\d{1,12}$/.test(s) || Number(s) < min) throw new FakeApiError(400, `Invalid integer: ${s}`, param, 'parameter_invalid_integer');
  return Number(s);
}

function parseLineItems(v: unknown): { items: FakeLineItem[]; currency: string } {
  const list = Array.isArray(v) ? v : Object.values(record(v));
  if (list.length === 0) throw new FakeApiError(400, 'Missing required param: line_items.', 'line_items', 'parameter_missing');
  let currency: string | null = null;
  const items = list.map((raw, i) => {
    const item = record(raw);
    const data = record(item.price_data);
    const product = record(data.product_data);
    const c = str(data.currency)?.toLowerCase() ?? null;
    if (!c || !/^[a-z]{3}$/.test(c)) throw new FakeApiError(400, 'Missing required param: line_items[0][price_data][currency].', `line_items[${i}][price_data][currency]`, 'parameter_missing');
    if (currency && c !== currency) throw new FakeApiError(400, 'All line items must use the same currency.', `line_items[${i}][price_data][currency]`);
    currency = c;
    const name = str(product.name);
    if (!name) throw new FakeApiError(400, 'Missing required param: line_items[0][price_data][product_data][name].', `line_items[${i}][price_data][product_data][name]`, 'parameter_missing');
    const behavior = str(data.tax_behavior);
    if (behavior !== null && !['inclusive', 'exclusive', 'unspecified'].includes(behavior)) {
      throw new FakeApiError(400, `Invalid tax_behavior: must be one of inclusive, exclusive, or unspecified`, `line_items[${i}][price_data][tax_behavior]`);
    }
    return {
      name,
      description: str(product.description),
      unit_amount: positiveInt(data.unit_amount, `line_items[${i}][price_data][unit_amount]`, 1),
      quantity: positiveInt(item.quantity, `line_items[${i}][quantity]`, 1),
      tax_behavior: behavior,
    };
  });
  return { items, currency: currency! };
}

/** Starts the fake and resolves once it listens. */
export async function startFakePayments(opts: FakePaymentsOptions): Promise<FakePayments> {
  const host = opts.host ?? '127.0.0.1';
  const secretKey = opts.secretKey ?? newSecret('api-key');
  const webhookSecret = opts.webhookSecret ?? newSecret('webhook');
  const retryDelays = opts.retryDelaysMs ?? [200, 1000, 3000];
  let webhookUrl = opts.webhookUrl ?? null;
  let baseUrl = '';
  const store = createStore();
  const inFlight = new Set<Promise<void>>();
  const timers = new Set<NodeJS.Timeout>();
  let closed = false;

  const record_ = (d: Omit<FakeDelivery, 'at'>) => store.deliveries.push({ ...d, at: new Date().toISOString() });

  /** One POST of `payload` (signed now); resolves with the status or null on a network error. */
  async function deliverOnce(event: FakeEvent, payload: string, attempt: number): Promise<number | null> {
    if (!webhookUrl) {
      record_({ eventId: event.id, type: event.type, attempt, status: null, error: 'no webhook URL set' });
      return null;
    }
    try {
      const res = await fetch(webhookUrl, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': signPayload(payload, webhookSecret), 'User-Agent': 'LoopwrightPaymentsFake/1.0' },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      await res.arrayBuffer();
      record_({ eventId: event.id, type: event.type, attempt, status: res.status, error: null });
      return res.status;
    } catch (err) {
      record_({ eventId: event.id, type: event.type, attempt, status: null, error: err instanceof Error ? err.message : String(err) });
      return null;
    }
  }

  /** Delivers with retries; the first attempt is awaited by callers that want it done before redirecting. */
  function deliver(event: FakeEvent, payload: string): Promise<void> {
    const run = (async () => {
      for (let attempt = 1; attempt <= retryDelays.length + 1 && !closed; attempt++) {
        const status = await deliverOnce(event, payload, attempt);
        if (status !== null && status >= 200 && status < 300) return;
        const delay = retryDelays[attempt - 1];
        if (delay === undefined || closed) return;
        await new Promise<void>((resolve) => { const t = setTimeout(() => { timers.delete(t); resolve(); }, delay); timers.add(t); });
      }
    })();
    inFlight.add(run);
    void run.finally(() => inFlight.delete(run));
    return run;
  }

  function emit(type: string, object: unknown, apiVersion: string): { event: FakeEvent; done: Promise<void> } {
    const event: FakeEvent = {
      id: newId('evt'), object: 'event', api_version: apiVersion, created: nowSeconds(), livemode: false,
      pending_webhooks: 1, request: { id: null, idempotency_key: null }, type, data: { object },
    };
    const payload = JSON.stringify(event, null, 2);
    store.events.set(event.id, { event, payload });
    return { event, done: deliver(event, payload) };
  }

  const apiVersions = new Map<string, string>();
  const versionOf = (sessionId: string) => apiVersions.get(sessionId) ?? 'unknown';

  function completePayment(session: FakeCheckoutSession): Promise<void> {
    const created = nowSeconds();
    const pi: FakePaymentIntent = {
      id: newId('pi'), object: 'payment_intent', amount: session.amount_total, amount_received: session.amount_total,
      currency: session.currency, created, latest_charge: '', livemode: false, metadata: session.metadata, status: 'succeeded',
    };
    const charge: FakeCharge = {
      id: newId('ch'), object: 'charge', amount: session.amount_total, amount_captured: session.amount_total, amount_refunded: 0,
      captured: true, created, currency: session.currency, livemode: false, metadata: session.metadata, paid: true,
      payment_intent: pi.id, refunded: false, status: 'succeeded',
    };
    pi.latest_charge = charge.id;
    store.paymentIntents.set(pi.id, pi);
    store.charges.set(charge.id, charge);
    session.status = 'complete';
    session.payment_status = 'paid';
    session.payment_intent = pi.id;
    return emit('checkout.session.completed', publicSession(session), versionOf(session.id)).done;
  }

  const successRedirect = (s: FakeCheckoutSession) => s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id);

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: true, limit: '100kb' }));

  // ---- the hosted page (no API key: the buyer's browser opens it) ----
  app.get('/pay/:id', (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) { res.status(404).type('text/plain').send('No such payment page.'); return; }
    res.type('html').send(hostedPageHtml(session));
  });

  app.post('/pay/:id', async (req, res) => {
    const session = store.sessions.get(req.params.id);
    if (!session) { res.status(404).type('text/plain').send('No such payment page.'); return; }
    if (session.status !== 'open') { res.status(409).type('html').send(hostedPageHtml(session)); return; }
    const body = record(req.body);
    if (body.action === 'cancel') {
      // Like the provider: leaving the page changes nothing; the session stays open until it expires.
      res.redirect(303, session.cancel_url ?? successRedirect(session));
      return;
    }
    const card = (str(body.card) ?? '').replace(/\s+/g, '');
    if (card === DECLINED_CARD) { res.status(402).type('html').send(hostedPageHtml(session, 'Your card was declined. Nothing was charged; try another card.')); return; }
    if (!/^\d{12,19}$/.test(card)) { res.status(400).type('html').send(hostedPageHtml(session, 'Enter a card number (12 to 19 digits).')); return; }
    await completePayment(session);
    res.redirect(303, successRedirect(session));
  });

  // ---- the API, as the SDK calls it ----
  const api = express.Router();
  api.use((req, _res, next) => {
    const auth = req.get('authorization') ?? '';
    if (auth !== `Bearer ${secretKey}`) {
      const shown = auth.startsWith('Bearer ') ? `${auth.slice(7, 15)}****${auth.slice(-4)}` : '';
      next(new FakeApiError(401, shown ? `Invalid API Key provided: ${shown}` : 'You did not provide an API key.'));
      return;
    }
    next();
  });
  // Same Idempotency-Key on a POST gives the same answer (the SDK retries with one).
  api.use((req, res, next) => {
    const key = req.method === 'POST' ? req.get('idempotency-key') : undefined;
    if (!key) { next(); return; }
    const cacheKey = `${req.path} ${key}`;
    const hit = store.idempotent.get(cacheKey);
    if (hit) { res.status(hit.status).set('Idempotent-Replayed', 'true').json(hit.body); return; }
    const json = res.json.bind(res);
    res.json = (body: unknown) => { store.idempotent.set(cacheKey, { status: res.statusCode, body }); return json(body); };
    next();
  });
  api.use((req, res, next) => {
    res.set('Request-Id', newId('req', 14));
    if (req.get('stripe-version')) res.set('Stripe-Version', req.get('stripe-version')!);
    next();
  });

  api.post('/v1/checkout/sessions', (req, res) => {
    const body = record(req.body);
    if (str(body.mode) !== 'payment') throw new FakeApiError(400, 'This stand-in supports mode=payment only.', 'mode');
    const successUrl = str(body.success_url);
    if (!successUrl) throw new FakeApiError(400, 'Missing required param: success_url.', 'success_url', 'parameter_missing');
    const { items, currency } = parseLineItems(body.line_items);
    const total = items.reduce((sum, i) => sum + i.unit_amount * i.quantity, 0);
    const created = nowSeconds();
    const id = newId('cs_test', 58);
    const email = str(body.customer_email);
    const session: FakeCheckoutSession = {
      id, object: 'checkout.session', amount_subtotal: total, amount_total: total,
      cancel_url: str(body.cancel_url), success_url: successUrl, client_reference_id: str(body.client_reference_id),
      created, currency, customer_email: email, customer_details: email ? { email } : null,
      expires_at: created + SESSION_LIFETIME_SECONDS, livemode: false, metadata: metadataOf(body.metadata), mode: 'payment',
      payment_intent: null, payment_status: 'unpaid', status: 'open', url: `${baseUrl}/pay/${id}`, line_items_data: items,
    };
    store.sessions.set(id, session);
    apiVersions.set(id, req.get('stripe-version') ?? 'unknown');
    res.json(publicSession(session));
  });

  api.get('/v1/checkout/sessions/:id', (req, res) => {
    const session = store.sessions.get(String(req.params.id));
    if (!session) throw new FakeApiError(404, `No such checkout.session: '${req.params.id}'`, 'session', 'resource_missing');
    res.json(publicSession(session));
  });

  api.post('/v1/checkout/sessions/:id/expire', (req, res) => {
    const session = store.sessions.get(String(req.params.id));
    if (!session) throw new FakeApiError(404, `No such checkout.session: '${req.params.id}'`, 'session', 'resource_missing');
    if (session.status !== 'open') throw new FakeApiError(400, `Only Checkout Sessions with a status in ["open"] can be expired. This Checkout Session has a status of "${session.status}".`, undefined, 'checkout_session_not_open');
    session.status = 'expired';
    session.url = null;
    emit('checkout.session.expired', publicSession(session), versionOf(session.id));
    res.json(publicSession(session));
  });

  api.post('/v1/refunds', (req, res) => {
    const body = record(req.body);
    const piId = str(body.payment_intent);
    const chargeId = str(body.charge);
    const pi = piId ? store.paymentIntents.get(piId) : undefined;
    const charge = chargeId ? store.charges.get(chargeId) : pi ? store.charges.get(pi.latest_charge) : undefined;
    if (!piId && !chargeId) throw new FakeApiError(400, 'One of the following params should be provided for this request: payment_intent or charge.', 'payment_intent', 'parameter_missing');
    if (!charge) throw new FakeApiError(404, `No such ${piId ? 'payment_intent' : 'charge'}: '${piId ?? chargeId}'`, piId ? 'payment_intent' : 'charge', 'resource_missing');
    const remaining = charge.amount - charge.amount_refunded;
    if (remaining <= 0) throw new FakeApiError(400, `Charge ${charge.id} has already been refunded.`, undefined, 'charge_already_refunded');
    const amount = body.amount === undefined ? remaining : positiveInt(body.amount, 'amount', 1);
    if (amount > remaining) throw new FakeApiError(400, `Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining}).`, 'amount', 'amount_too_large');
    const reason = str(body.reason);
    const refund: FakeRefund = {
      id: newId('re'), object: 'refund', amount, charge: charge.id, created: nowSeconds(), currency: charge.currency,
      metadata: metadataOf(body.metadata), payment_intent: charge.payment_intent, reason, status: 'succeeded',
    };
    store.refunds.set(refund.id, refund);
    charge.amount_refunded += amount;
    charge.refunded = charge.amount_refunded >= charge.amount;
    const session = [...store.sessions.values()].find((s) => s.payment_intent === charge.payment_intent);
    res.json(refund);
    // The event follows the API answer, as with the provider.
    setImmediate(() => emit('charge.refunded', { ...charge }, session ? versionOf(session.id) : req.get('stripe-version') ?? 'unknown'));
  });

  api.use((req, _res, next) => next(new FakeApiError(404, `Unrecognized request URL (${req.method}: ${req.path}). This local stand-in implements only the calls Loopwright makes.`)));
  app.use(api);
  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    const e = err instanceof FakeApiError ? err : new FakeApiError(500, err instanceof Error ? err.message : 'internal error', undefined, undefined, 'api_error');
    res.status(e.status).json({ error: { type: e.type, message: e.message, ...(e.param ? { param: e.param } : {}), ...(e.code ? { code: e.code } : {}) } });
  });

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(opts.port, host, () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new Error(`Port ${opts.port} for the local payment stand-in is in use; set PAYMENTS_FAKE_PORT to another port.`) : err));
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${host}:${port}`;

  return {
    host, port, url: baseUrl, secretKey, webhookSecret, store,
    setWebhookUrl(url) { webhookUrl = url; },
    async pay(sessionId) {
      const session = store.sessions.get(sessionId);
      if (!session || session.status !== 'open') throw new Error(`session ${sessionId} is not open`);
      await completePayment(session);
      return successRedirect(session);
    },
    async resend(eventId) {
      const stored = store.events.get(eventId);
      if (!stored) throw new Error(`no event ${eventId}`);
      return deliverOnce(stored.event, stored.payload, 0);
    },
    async settle() {
      while (inFlight.size) await Promise.allSettled([...inFlight]);
    },
    async close() {
      closed = true;
      for (const t of timers) clearTimeout(t);
      await new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); });
    },
  };
}
