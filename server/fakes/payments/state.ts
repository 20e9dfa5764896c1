/**
 * The fake's objects, in the JSON shapes the provider's API answers with
 * (`object` field, ids with the usual prefixes, amounts as integers in
 * minor units, lower-case currency codes, times in Unix seconds), kept in
 * memory for one run.
 */

/** A line item as the app sent it with `price_data` (kept for the hosted page). */
export interface FakeLineItem { name: string; description: string | null; unit_amount: number; quantity: number; tax_behavior: string | null }

/** `checkout.session`. `line_items_data` is ours (the real API lists line items separately) and is not sent. */
export interface FakeCheckoutSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  success_url: string;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer_email: string | null;
  customer_details: { email: string | null } | null;
  expires_at: number;
  livemode: false;
  metadata: Record<string, string>;
  mode: 'payment';
  payment_intent: string | null;
  payment_status: 'paid' | 'unpaid';
  status: 'open' | 'complete' | 'expired';
  url: string | null;
  line_items_data: FakeLineItem[];
}

/** `payment_intent` (only what a completed card payment needs). */
export interface FakePaymentIntent {
  id: string; object: 'payment_intent'; amount: number; amount_received: number; currency: string; created: number;
  latest_charge: string; livemode: false; metadata: Record<string, string>; status: 'succeeded';
}

/** `charge`. */
export interface FakeCharge {
  id: string; object: 'charge'; amount: number; amount_captured: number; amount_refunded: number; captured: true;
  created: number; currency: string; livemode: false; metadata: Record<string, string>; paid: true;
  payment_intent: string; refunded: boolean; status: 'succeeded';
}

/** `refund`. */
export interface FakeRefund {
  id: string; object: 'refund'; amount: number; charge: string; created: number; currency: string;
  metadata: Record<string, string>; payment_intent: string; reason: string | null; status: 'succeeded';
}

/** `event` as delivered to the webhook endpoint. */
export interface FakeEvent {
  id: string; object: 'event'; api_version: string; created: number; livemode: false; pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null }; type: string; data: { object: unknown };
}

/** One delivery attempt of an event to the app. */
export interface FakeDelivery { eventId: string; type: string; attempt: number; status: number | null; error: string | null; at: string }

/** Everything the fake knows during one run. */
export interface FakeStore {
  sessions: Map<string, FakeCheckoutSession>;
  paymentIntents: Map<string, FakePaymentIntent>;
  charges: Map<string, FakeCharge>;
  refunds: Map<string, FakeRefund>;
  events: Map<string, { event: FakeEvent; payload: string }>;
  deliveries: FakeDelivery[];
  /** Answers already given per `Idempotency-Key` (the SDK retries POSTs with the same key). */
  idempotent: Map<string, { status: number; body: unknown }>;
}

/** An empty store. */
export function createStore(): FakeStore {
  return { sessions: new Map(), paymentIntents: new Map(), charges: new Map(), refunds: new Map(), events: new Map(), deliveries: [], idempotent: new Map() };
}

/** The session as the API sends it (without our `line_items_data`). */
export function publicSession(s: FakeCheckoutSession): Omit<FakeCheckoutSession, 'line_items_data'> {
  const { line_items_data: _items, ...rest } = s;
  return rest;
}

/** Unix time in seconds. */
export const nowSeconds = () => Math.floor(Date.now() / 1000);
