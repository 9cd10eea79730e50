import 'server-only';
import Stripe from 'stripe';
import { getEnv, type Env } from '@/server/env';

/**
 * Builds the provider client from the environment alone. With STRIPE_API_HOST/PORT/PROTOCOL unset
 * the SDK talks to api.stripe.com; set, it talks to that Stripe-compatible endpoint (the local
 * fake in development and tests). There is no other switch: the same calls go either way.
 */
export function stripeConfigFromEnv(env: Pick<Env, 'STRIPE_API_HOST' | 'STRIPE_API_PORT' | 'STRIPE_API_PROTOCOL'>): Stripe.StripeConfig {
  const config: Stripe.StripeConfig = {
    // The SDK adds idempotency keys to its retries, so a retried POST never doubles.
    maxNetworkRetries: 2,
    // Webhook handling can call the provider while holding row locks: keep a hung call short.
    timeout: 15_000,
    telemetry: false,
    appInfo: { name: 'FadeLedger' },
  };
  if (env.STRIPE_API_HOST) config.host = env.STRIPE_API_HOST;
  if (env.STRIPE_API_PORT) config.port = env.STRIPE_API_PORT;
  if (env.STRIPE_API_PROTOCOL) config.protocol = env.STRIPE_API_PROTOCOL;
  return config;
}

const holder = globalThis as unknown as { __fadeledgerStripe?: Stripe };

/** The one provider client of this process (stateless apart from its HTTP agent). */
export function getStripe(): Stripe {
  if (!holder.__fadeledgerStripe) {
    const env = getEnv();
    holder.__fadeledgerStripe = new Stripe(env.STRIPE_SECRET_KEY, stripeConfigFromEnv(env));
  }
  return holder.__fadeledgerStripe;
}

/** True for the provider's "no such object" answer (an id from another account, mode or a reset). */
export function isMissingResource(error: unknown): boolean {
  const e = error as { type?: string; code?: string; statusCode?: number } | null;
  return !!e && e.type === 'StripeInvalidRequestError' && (e.code === 'resource_missing' || e.statusCode === 404);
}

/** Safe to show: the provider's message for a request error, never our key or its headers. */
export function providerMessage(error: unknown): string {
  const e = error as { type?: string; message?: string } | null;
  if (e?.type === 'StripeConnectionError') return 'The payment provider could not be reached. Try again in a minute.';
  if (e?.type === 'StripeAuthenticationError') return 'The payment provider refused our API key (check STRIPE_SECRET_KEY).';
  if (e?.type?.startsWith('Stripe') && e.message) return `The payment provider said: ${e.message}`;
  return 'The payment provider could not complete the request.';
}
