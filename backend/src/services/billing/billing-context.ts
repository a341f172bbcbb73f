/** What every billing use case needs: the database, the configuration, the Stripe SDK and the price catalogue read back from Stripe. */
import type Stripe from 'stripe';
import type { DataSource } from 'typeorm';
import type { Config } from '../../config.js';
import { syncCatalogue, type Catalogue } from './catalogue-sync.js';
import { callStripe, createStripeClient } from './stripe-client.js';

export interface BillingContext {
  ds: DataSource;
  config: Config;
  stripe: Stripe;
  /** Made and read back once per process; a failed attempt is tried again on the next call. */
  catalogue: () => Promise<Catalogue>;
}

export function createBillingContext(ds: DataSource, config: Config, stripe: Stripe = createStripeClient(config)): BillingContext {
  let pending: Promise<Catalogue> | null = null;
  return {
    ds,
    config,
    stripe,
    catalogue: () => {
      pending ??= callStripe('price', () => syncCatalogue(stripe)).catch((err: unknown) => {
        pending = null;
        throw err;
      });
      return pending;
    },
  };
}
