/**
 * Makes our products and prices in Stripe when they are missing (by lookup key, so running it again or from
 * two processes changes nothing) and reads them back: the price ids and amounts used are Stripe's.
 */
import type Stripe from 'stripe';
import { CURRENCY, INTERVALS, lookupKeyOf, PLANS, productIdOf, type Interval, type PlanDefinition } from './plan-catalogue.js';

export interface CataloguePrice {
  lookupKey: string;
  priceId: string;
  plan: PlanDefinition;
  interval: Interval;
  cents: number;
  currency: string;
}

export type Catalogue = Map<string, CataloguePrice>;

const ALL_KEYS = PLANS.flatMap((plan) => INTERVALS.map((interval) => ({ plan, interval, key: lookupKeyOf(plan, interval) })));

async function readBack(stripe: Stripe): Promise<Map<string, Stripe.Price>> {
  const found = new Map<string, Stripe.Price>();
  // Stripe takes at most 10 lookup keys per list call.
  for (let i = 0; i < ALL_KEYS.length; i += 10) {
    const page = await stripe.prices.list({ lookup_keys: ALL_KEYS.slice(i, i + 10).map((k) => k.key), active: true, limit: 100 });
    for (const price of page.data) if (price.lookup_key && !found.has(price.lookup_key)) found.set(price.lookup_key, price);
  }
  return found;
}

async function ensureProduct(stripe: Stripe, plan: PlanDefinition): Promise<string> {
  const id = productIdOf(plan);
  try {
    return (await stripe.products.retrieve(id)).id;
  } catch {
    try {
      return (await stripe.products.create({ id, name: `Cleancase ${plan.name}` })).id;
    } catch {
      // Made meanwhile by another process.
      return (await stripe.products.retrieve(id)).id;
    }
  }
}

export async function syncCatalogue(stripe: Stripe): Promise<Catalogue> {
  let existing = await readBack(stripe);
  const missing = ALL_KEYS.filter((k) => !existing.has(k.key));
  for (const { plan, interval, key } of missing) {
    const product = await ensureProduct(stripe, plan);
    try {
      await stripe.prices.create({ product, currency: CURRENCY, unit_amount: plan.cents[interval], recurring: { interval }, lookup_key: key });
    } catch {
      // Another process made it first (Stripe keeps a lookup key on one price): read back below.
    }
  }
  if (missing.length) existing = await readBack(stripe);
  const catalogue: Catalogue = new Map();
  for (const { plan, interval, key } of ALL_KEYS) {
    const price = existing.get(key);
    if (!price || price.unit_amount === null) throw new Error(`Stripe has no price with lookup key ${key}`);
    catalogue.set(key, { lookupKey: key, priceId: price.id, plan, interval, cents: price.unit_amount, currency: price.currency });
  }
  return catalogue;
}
