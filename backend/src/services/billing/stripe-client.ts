/** The one place the `stripe` SDK is configured: the real API, or the server STRIPE_API_BASE names (the local stand-in). */
import Stripe from 'stripe';
import type { Config } from '../../config.js';
import { AppError } from '../../http/app-error.js';

export function createStripeClient(config: Config): Stripe {
  if (!config.STRIPE_API_BASE) return new Stripe(config.STRIPE_SECRET_KEY, { maxNetworkRetries: 2, timeout: 20_000 });
  const base = new URL(config.STRIPE_API_BASE);
  const protocol = base.protocol === 'https:' ? 'https' : 'http';
  return new Stripe(config.STRIPE_SECRET_KEY, {
    host: base.hostname,
    port: Number(base.port || (protocol === 'https' ? 443 : 80)),
    protocol,
    maxNetworkRetries: 0,
    timeout: 10_000,
  });
}

/** The local stand-in is in use: the app registers its webhook address with it at start. */
export function usesLocalStripe(config: Config): boolean {
  return config.STRIPE_SECRET_KEY.startsWith('sk_test_cleancase');
}

const UNREACHABLE = 'The payment service (Stripe) is not answering just now, so nothing was changed. Try again in a few minutes.';

/** A Stripe call whose failure becomes a clear 503 (nothing here has been written when it throws). */
export async function callStripe<T>(what: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (err instanceof AppError) throw err;
    const e = err as { type?: string; statusCode?: number; message?: string };
    if (e.type === 'StripeInvalidRequestError' && e.statusCode === 404) throw new AppError(409, `Stripe does not know this ${what} any more: reload the page`);
    throw new AppError(503, UNREACHABLE, { stripe: e.type ?? 'connection' });
  }
}
