/** Billing test helpers: the Stripe stand-in through the SDK, checkout paid on its page, and events delivered to the app signed as Stripe signs them. */
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import Stripe from 'stripe';
import type { CleancaseApp } from '../../backend/src/app.js';
import type { Config } from '../../backend/src/config.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import type { DataSource } from 'typeorm';
import { CSRF } from './accounts.js';

export function stripeOf(config: Config): Stripe {
  const base = new URL(config.STRIPE_API_BASE!);
  return new Stripe(config.STRIPE_SECRET_KEY, { host: base.hostname, port: Number(base.port), protocol: 'http', maxNetworkRetries: 0 });
}

/** Checkout through the API, paid on the stand-in's page; answers the organisation as it is afterwards (before any webhook). */
export async function payCheckout(agent: TestAgent, price: string): Promise<{ url: string; sessionId: string }> {
  const res = await agent.post('/api/billing/checkout').set(CSRF).send({ price });
  if (res.status !== 200) throw new Error(`checkout answered ${res.status}: ${JSON.stringify(res.body)}`);
  const url = res.body.url as string;
  const paid = await fetch(url, { method: 'POST', body: new URLSearchParams({ outcome: 'pay' }), redirect: 'manual' });
  if (paid.status !== 303) throw new Error(`the stand-in's pay page answered ${paid.status}`);
  return { url, sessionId: url.split('/').pop()! };
}

/** Every event the stand-in sent about a customer, oldest first. */
export async function eventsOf(config: Config, customer: string): Promise<Stripe.Event[]> {
  const res = await fetch(`${config.STRIPE_API_BASE}/_fake/events?customer=${encodeURIComponent(customer)}`);
  return ((await res.json()) as { data: Stripe.Event[] }).data;
}

export async function fakeControl(config: Config, path: string, body: Record<string, string> = {}): Promise<void> {
  const res = await fetch(`${config.STRIPE_API_BASE}/_fake/${path}`, { method: 'POST', body: new URLSearchParams(body) });
  if (!res.ok) throw new Error(`${path}: ${res.status}`);
}

export interface Delivery {
  secret?: string;
  /** Seconds since the epoch written into the signature (default now). */
  timestamp?: number;
}

/** POSTs the event to the app's webhook the way Stripe does: the exact bytes, signed with the SDK's test-header helper. */
export async function deliver(app: CleancaseApp, config: Config, event: Stripe.Event, options: Delivery = {}) {
  const payload = JSON.stringify(event);
  const header = stripeOf(config).webhooks.generateTestHeaderString({
    payload,
    secret: options.secret ?? config.STRIPE_WEBHOOK_SECRET,
    ...(options.timestamp ? { timestamp: options.timestamp } : {}),
  });
  return request(app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', header).send(payload);
}

/** Delivers every event the stand-in sent about the organisation's customer so far, in order. */
export async function deliverAll(app: CleancaseApp, config: Config, ds: DataSource, organisationId: string): Promise<Stripe.Event[]> {
  const org = await ds.getRepository(Organisation).findOneByOrFail({ id: organisationId });
  const events = await eventsOf(config, org.stripeCustomerId!);
  for (const e of events) {
    const res = await deliver(app, config, e);
    if (res.status !== 204) throw new Error(`${e.type} answered ${res.status}: ${JSON.stringify(res.body)}`);
  }
  return events;
}
