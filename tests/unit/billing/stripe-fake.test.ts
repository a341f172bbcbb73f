/**
 * The local Stripe stand-in, driven only through the official `stripe` SDK: the endpoints it adds to
 * stripe-stateful-mock answer with Stripe's object shapes, and the events it delivers verify with `constructEvent`.
 */
import http from 'node:http';
import net from 'node:net';
import os from 'node:os';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../../scripts/lib/free-port.js';
import { startStripeFake, type StripeFake } from '../../../scripts/lib/local-services.js';

const SECRET = 'whsec_fake_test_secret';
let fake: StripeFake;
let stripe: Stripe;
let hook: http.Server;
let hookUrl: string;
const received: Stripe.Event[] = [];
const rejected: string[] = [];

beforeAll(async () => {
  const port = await freePort();
  fake = await startStripeFake(port, SECRET);
  stripe = new Stripe('sk_test_fake_suite', { host: '127.0.0.1', port, protocol: 'http', maxNetworkRetries: 0 });
  hook = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      try {
        received.push(stripe.webhooks.constructEvent(Buffer.concat(chunks), String(req.headers['stripe-signature']), SECRET));
        res.writeHead(200).end();
      } catch (err) {
        rejected.push(String(err));
        res.writeHead(400).end();
      }
    });
  });
  await new Promise<void>((r) => hook.listen(0, '127.0.0.1', () => r()));
  hookUrl = `http://127.0.0.1:${(hook.address() as { port: number }).port}/hook`;
});
afterAll(async () => {
  await fake?.stop();
  await new Promise((r) => hook?.close(r));
});

async function waitForEvent(type: string, objectId: string): Promise<Stripe.Event> {
  for (let i = 0; i < 100; i++) {
    const found = received.find((e) => e.type === type && (e.data.object as { id?: string }).id === objectId);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no ${type} for ${objectId} arrived; rejected: ${rejected.join('; ')}`);
}

async function priceFor(lookupKey: string, amount: number, interval: 'month' | 'year') {
  const product = await stripe.products.create({ name: `Plan ${lookupKey}` });
  return stripe.prices.create({ product: product.id, unit_amount: amount, currency: 'usd', recurring: { interval }, lookup_key: lookupKey });
}

describe('the Stripe stand-in through the SDK', () => {
  it('finds prices by lookup key and nothing else', async () => {
    const a = await priceFor('fake_test_small_month', 1200, 'month');
    await priceFor('fake_test_other', 999, 'month');
    const found = await stripe.prices.list({ lookup_keys: ['fake_test_small_month', 'fake_test_missing'] });
    expect(found.data.map((p) => p.id)).toEqual([a.id]);
  });

  it('refuses a key that is not a test secret key', async () => {
    const wrong = new Stripe('rk_live_not_a_test_key', { host: '127.0.0.1', port: Number(new URL(fake.apiBase).port), protocol: 'http', maxNetworkRetries: 0 });
    await expect(wrong.customers.create({})).rejects.toMatchObject({ statusCode: 401 });
  });

  it('runs a checkout session to a subscription and delivers the three signed events', async () => {
    await stripe.webhookEndpoints.create({ url: hookUrl, enabled_events: ['*'] });
    const price = await priceFor('fake_test_checkout', 4500, 'month');
    const customer = await stripe.customers.create({ email: 'buyer@example.test' });
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      client_reference_id: 'org-1',
      line_items: [{ price: price.id, quantity: 1 }],
      subscription_data: { metadata: { organisationId: 'org-1' } },
      success_url: 'http://127.0.0.1/done',
    });
    expect(session.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/);
    const page = await fetch(session.url!);
    expect(await page.text()).toContain('Pay with the test card');
    const paid = await fetch(session.url!, { method: 'POST', body: new URLSearchParams({ outcome: 'pay' }), redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe('http://127.0.0.1/done');

    const completed = await waitForEvent('checkout.session.completed', session.id);
    const subId = (completed.data.object as Stripe.Checkout.Session).subscription as string;
    const created = await waitForEvent('customer.subscription.created', subId);
    const sub = created.data.object as Stripe.Subscription;
    expect(sub.metadata).toEqual({ organisationId: 'org-1' });
    expect(sub.items.data[0]!.price.id).toBe(price.id);
    expect(sub.items.data[0]!.current_period_end).toBeGreaterThan(sub.items.data[0]!.current_period_start);
    const invoices = await stripe.invoices.list({ customer: customer.id });
    expect(invoices.data).toHaveLength(1);
    expect(invoices.data[0]).toMatchObject({ status: 'paid', amount_paid: 4500, customer: customer.id });
    await waitForEvent('invoice.paid', invoices.data[0]!.id!);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('complete');
  });

  it('a declined card leaves the session open and makes no subscription', async () => {
    const price = await priceFor('fake_test_decline', 100, 'month');
    const customer = await stripe.customers.create({});
    const session = await stripe.checkout.sessions.create({
      mode: 'subscription',
      customer: customer.id,
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: 'http://127.0.0.1/x',
    });
    const res = await fetch(session.url!, { method: 'POST', body: new URLSearchParams({ outcome: 'decline' }), redirect: 'manual' });
    expect(res.status).toBe(402);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('open');
    expect((await stripe.subscriptions.list({ customer: customer.id })).data).toHaveLength(0);
  });

  it('changes the price, cancels at the period end, resumes, and cancels now', async () => {
    const small = await priceFor('fake_test_change_a', 1000, 'month');
    const large = await priceFor('fake_test_change_b', 90_000, 'year');
    const customer = await stripe.customers.create({});
    const sub = await stripe.subscriptions.create({ customer: customer.id, items: [{ price: small.id }] });
    expect(sub.status).toBe('active');
    const item = sub.items.data[0]!;
    const changed = await stripe.subscriptions.update(sub.id, { items: [{ id: item.id, price: large.id }], proration_behavior: 'create_prorations' });
    expect(changed.items.data[0]!.price.id).toBe(large.id);
    expect((await stripe.subscriptions.retrieve(sub.id)).items.data[0]!.price.id).toBe(large.id);
    expect((await stripe.subscriptions.update(sub.id, { cancel_at_period_end: true })).cancel_at_period_end).toBe(true);
    expect((await stripe.subscriptions.update(sub.id, { cancel_at_period_end: false })).cancel_at_period_end).toBe(false);
    const ended = await stripe.subscriptions.cancel(sub.id);
    expect(ended.status).toBe('canceled');
    await waitForEvent('customer.subscription.deleted', sub.id);
    await expect(stripe.subscriptions.update(sub.id, { cancel_at_period_end: true })).rejects.toMatchObject({ statusCode: 400 });
  });

  it('makes billing-portal sessions whose page lists the subscription', async () => {
    const customer = await stripe.customers.create({});
    const price = await priceFor('fake_test_portal', 500, 'month');
    const sub = await stripe.subscriptions.create({ customer: customer.id, items: [{ price: price.id }] });
    const portal = await stripe.billingPortal.sessions.create({ customer: customer.id, return_url: 'http://127.0.0.1/back' });
    expect(portal.object).toBe('billing_portal.session');
    const html = await (await fetch(portal.url)).text();
    expect(html).toContain(sub.id);
    expect(html).toContain('http://127.0.0.1/back');
  });

  it('a failed renewal makes the subscription past due and sends invoice.payment_failed', async () => {
    const customer = await stripe.customers.create({});
    const price = await priceFor('fake_test_fail', 700, 'month');
    const sub = await stripe.subscriptions.create({ customer: customer.id, items: [{ price: price.id }] });
    await fetch(`${fake.apiBase}/_fake/subscriptions/${sub.id}/payment-failed`, { method: 'POST' });
    expect((await stripe.subscriptions.retrieve(sub.id)).status).toBe('past_due');
    const open = (await stripe.invoices.list({ customer: customer.id })).data.find((i) => i.status === 'open');
    expect(open).toBeDefined();
    await waitForEvent('invoice.payment_failed', open!.id!);
  });

  it('answers the chosen error status while told to fail, then works again', async () => {
    await fetch(`${fake.apiBase}/_fake/fail-next`, { method: 'POST', body: new URLSearchParams({ count: '1', status: '500' }) });
    await expect(stripe.customers.create({})).rejects.toMatchObject({ statusCode: 500 });
    await expect(stripe.customers.create({})).resolves.toMatchObject({ object: 'customer' });
    // Only the calls that name `match` fail.
    await fetch(`${fake.apiBase}/_fake/fail-next`, { method: 'POST', body: new URLSearchParams({ count: '1', status: '503', match: 'org-outage' }) });
    await expect(stripe.customers.create({ metadata: { organisationId: 'org-other' } })).resolves.toMatchObject({ object: 'customer' });
    await expect(stripe.customers.create({ metadata: { organisationId: 'org-outage' } })).rejects.toMatchObject({ statusCode: 503 });
  });

  it('cannot be reached on any address but loopback', async () => {
    const outside = Object.values(os.networkInterfaces())
      .flat()
      .find((a) => a && a.family === 'IPv4' && !a.internal);
    const port = Number(new URL(fake.apiBase).port);
    if (outside) {
      const outcome = await new Promise<string>((resolve) => {
        const socket = net.connect(port, outside.address);
        socket.once('connect', () => (socket.destroy(), resolve('connected')));
        socket.once('error', (e: NodeJS.ErrnoException) => resolve(e.code ?? 'error'));
      });
      expect(outcome).toBe('ECONNREFUSED');
    }
    await expect(fetch(`http://127.0.0.1:${port}/`)).resolves.toBeDefined();
  });
});
