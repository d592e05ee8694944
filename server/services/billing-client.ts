import Stripe from 'stripe';
import type { Config } from '../config';

/**
 * The payment provider's official SDK, configured from the environment only: the local fake by
 * default; a real account is a matter of STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET and
 * STRIPE_API_HOST/PORT/PROTOCOL (docs/billing.md).
 */
export function createPaymentClient(config: Config): Stripe {
  return new Stripe(config.STRIPE_SECRET_KEY, {
    host: config.STRIPE_API_HOST,
    port: config.STRIPE_API_PORT ?? config.PAYMENTS_PORT,
    protocol: config.STRIPE_API_PROTOCOL,
    maxNetworkRetries: 2,
    timeout: 20_000,
    appInfo: { name: 'spinyard' },
  });
}

const clients = new WeakMap<Config, Stripe>();

/** One client per configuration object (keeps its connection pool). */
export function paymentClient(config: Config): Stripe {
  let client = clients.get(config);
  if (!client) {
    client = createPaymentClient(config);
    clients.set(config, client);
  }
  return client;
}
