/**
 * Webhook signatures in the scheme the provider's SDK verifies
 * (`stripe.webhooks.constructEvent`): header `t=<unix seconds>,v1=<hex>`,
 * where the hex is HMAC-SHA256 with the endpoint secret over
 * `<t>.<raw JSON body>`.
 */
import { createHmac } from 'node:crypto';

/** The `Stripe-Signature` header value for `payload` signed at `timestamp` (seconds; default now). */
export function signPayload(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}
