/**
 * The payment provider, through its official Node SDK. The same code talks
 * to the real service or to the local stand-in (server/fakes/payments.ts):
 * only the key, the webhook secret and the API host/port/protocol differ.
 *
 * Environment (server/index.ts): STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET,
 * and for a stand-in STRIPE_API_HOST, STRIPE_API_PORT, STRIPE_API_PROTOCOL
 * (default https). Without a key the shop lists but cannot sell (503).
 * No key is ever committed; local runs generate throwaway ones.
 */
import Stripe from 'stripe';

/** Where and how to reach the provider. */
export interface PaymentsConfig {
  secretKey: string;
  /** Endpoint secret the webhooks are signed with. */
  webhookSecret: string;
  /** API host; default the provider's own. */
  host?: string;
  port?: number;
  protocol?: 'http' | 'https';
  /** Seconds a signed webhook stays acceptable (default 300, the SDK's). Older ones are refused as replays. */
  toleranceSeconds?: number;
}

/** An SDK client plus what webhook verification needs. */
export interface Payments {
  stripe: Stripe;
  webhookSecret: string;
  toleranceSeconds: number;
}

/** Builds the SDK client for `config`. */
export function createPayments(config: PaymentsConfig): Payments {
  const stripe = new Stripe(config.secretKey, {
    ...(config.host ? { host: config.host } : {}),
    ...(config.port ? { port: config.port } : {}),
    ...(config.protocol ? { protocol: config.protocol } : {}),
    // One retry on a dropped connection; the SDK sends an idempotency key with it.
    maxNetworkRetries: 1,
    timeout: 20_000,
    appInfo: { name: 'Loopwright' },
  });
  return { stripe, webhookSecret: config.webhookSecret, toleranceSeconds: config.toleranceSeconds ?? 300 };
}

/** Reads {@link PaymentsConfig} from the environment, or null when no key is set. */
export function paymentsConfigFromEnv(env: NodeJS.ProcessEnv = process.env): PaymentsConfig | null {
  if (!env.STRIPE_SECRET_KEY || !env.STRIPE_WEBHOOK_SECRET) return null;
  const protocol = env.STRIPE_API_PROTOCOL === 'http' ? 'http' : env.STRIPE_API_PROTOCOL === 'https' ? 'https' : undefined;
  return {
    secretKey: env.STRIPE_SECRET_KEY,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET,
    ...(env.STRIPE_API_HOST ? { host: env.STRIPE_API_HOST } : {}),
    ...(env.STRIPE_API_PORT ? { port: Number(env.STRIPE_API_PORT) } : {}),
    ...(protocol ? { protocol } : {}),
  };
}
