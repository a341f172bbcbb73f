/**
 * The webhook matrix: each handled Stripe event type × {valid, bad signature, stale timestamp, duplicate ×3,
 * out-of-order pair, handler crash then retry}. Events are the ones the Stripe stand-in really sent, delivered
 * signed with the SDK's test-header helper. Each case ends with exactly one effect, or none when refused.
 */
import type Stripe from 'stripe';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { BillingWebhookEvent } from '../../backend/src/entities/billing-webhook-event.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { webhookFaults } from '../../backend/src/services/billing/receive-webhook.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { createTenant, signedInAgent, type TenantFixture } from '../factories/accounts.js';
import { deliver, eventsOf, fakeControl, payCheckout, stripeOf } from '../factories/billing.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});
afterEach(() => {
  webhookFaults.afterEffect = null;
});

type EventType =
  | 'checkout.session.completed'
  | 'customer.subscription.created'
  | 'customer.subscription.updated'
  | 'customer.subscription.deleted'
  | 'invoice.paid'
  | 'invoice.payment_failed';

interface Scenario {
  tenant: TenantFixture;
  customer: string;
  subscription: string;
  /** The event under test, as the stand-in sent it. */
  event: Stripe.Event;
  /** An event Stripe sent after it (delivered first in the out-of-order case). */
  later: Stripe.Event;
}

const org = (id: string) => t.dataSource.getRepository(Organisation).findOneByOrFail({ id });
const rowsOf = (eventId: string) => t.dataSource.getRepository(BillingWebhookEvent).countBy({ id: eventId });

async function newEvents(customer: string, since: number, type: string): Promise<Stripe.Event> {
  const all = await eventsOf(t.config, customer);
  const found = all.slice(since).find((e) => e.type === type);
  if (!found) throw new Error(`the stand-in sent no ${type}`);
  return found;
}

/** A trial tenant that paid on the Checkout page; its events are made but not yet delivered. */
async function scenario(type: EventType): Promise<Scenario> {
  const tenant = await createTenant(t.dataSource, 'hook');
  const admin = await signedInAgent(t.app, tenant.users.admin.email);
  await payCheckout(admin, 'cleancase_station_month');
  const customer = (await org(tenant.organisation.id)).stripeCustomerId!;
  const first = await eventsOf(t.config, customer);
  const subscription = (first.find((e) => e.type === 'customer.subscription.created')!.data.object as Stripe.Subscription).id;
  const stripe = stripeOf(t.config);
  const mark = async () => (await eventsOf(t.config, customer)).length;
  const pick = (type2: string) => first.find((e) => e.type === type2)!;
  switch (type) {
    case 'checkout.session.completed':
    case 'customer.subscription.created':
    case 'invoice.paid': {
      const n = await mark();
      await stripe.subscriptions.update(subscription, { cancel_at_period_end: true });
      return { tenant, customer, subscription, event: pick(type), later: await newEvents(customer, n, 'customer.subscription.updated') };
    }
    case 'customer.subscription.updated': {
      let n = await mark();
      await stripe.subscriptions.update(subscription, { cancel_at_period_end: true });
      const event = await newEvents(customer, n, 'customer.subscription.updated');
      n = await mark();
      await stripe.subscriptions.cancel(subscription);
      return { tenant, customer, subscription, event, later: await newEvents(customer, n, 'customer.subscription.deleted') };
    }
    case 'customer.subscription.deleted': {
      const n = await mark();
      await stripe.subscriptions.cancel(subscription);
      const event = await newEvents(customer, n, 'customer.subscription.deleted');
      // Its pair: the creation, which Stripe sent before it, arrives after it.
      return { tenant, customer, subscription, event, later: pick('customer.subscription.created') };
    }
    case 'invoice.payment_failed': {
      let n = await mark();
      await fakeControl(t.config, `subscriptions/${subscription}/payment-failed`);
      const event = await newEvents(customer, n, 'invoice.payment_failed');
      n = await mark();
      await fakeControl(t.config, `subscriptions/${subscription}/renew`);
      return { tenant, customer, subscription, event, later: await newEvents(customer, n, 'invoice.paid') };
    }
  }
}

/** The organisation says what Stripe says about the subscription now. */
async function expectInStepWithStripe(s: Scenario) {
  const sub = await stripeOf(t.config).subscriptions.retrieve(s.subscription);
  const o = await org(s.tenant.organisation.id);
  expect({ id: o.stripeSubscriptionId, status: o.subscriptionStatus, cancel: o.cancelAtPeriodEnd, plan: o.plan }).toEqual({
    id: sub.id,
    status: sub.status,
    cancel: sub.cancel_at_period_end,
    plan: 'station',
  });
}

/** Billing mail to the tenant's administrator, by subject start. */
async function billingMail(s: Scenario) {
  const mails = await t.mailTo(s.tenant.users.admin.email);
  return { receipts: mails.filter((m) => m.subject.startsWith('Receipt')).length, failed: mails.filter((m) => m.subject.startsWith('Payment for')).length };
}

const expectedMail = (type: EventType) => ({ receipts: type === 'invoice.paid' ? 1 : 0, failed: type === 'invoice.payment_failed' ? 1 : 0 });

async function expectUnchanged(s: Scenario, before: Organisation) {
  expect(await rowsOf(s.event.id)).toBe(0);
  expect(await org(s.tenant.organisation.id)).toEqual(before);
  expect(await billingMail(s)).toEqual({ receipts: 0, failed: 0 });
}

const TYPES: EventType[] = [
  'checkout.session.completed',
  'customer.subscription.created',
  'customer.subscription.updated',
  'customer.subscription.deleted',
  'invoice.paid',
  'invoice.payment_failed',
];

describe.each(TYPES)('%s', (type) => {
  it('valid: applied once, in step with Stripe, answered only after the commit', async () => {
    const s = await scenario(type);
    const res = await deliver(t.app, t.config, s.event);
    expect(res.status).toBe(204);
    // The answer came after the commit: a fresh read sees the effect.
    expect(await rowsOf(s.event.id)).toBe(1);
    await expectInStepWithStripe(s);
    expect(await billingMail(s)).toEqual(expectedMail(type));
  });

  it('bad signature: 400 and nothing changes', async () => {
    const s = await scenario(type);
    const before = await org(s.tenant.organisation.id);
    const res = await deliver(t.app, t.config, s.event, { secret: 'whsec_someone_else' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/signature/);
    await expectUnchanged(s, before);
  });

  it('stale timestamp (over 300 s): 400 and nothing changes', async () => {
    const s = await scenario(type);
    const before = await org(s.tenant.organisation.id);
    const res = await deliver(t.app, t.config, s.event, { timestamp: Math.floor(Date.now() / 1000) - 301 });
    expect(res.status).toBe(400);
    await expectUnchanged(s, before);
  });

  it('duplicate ×3 at once: every delivery answered 2xx, one effect', async () => {
    const s = await scenario(type);
    const answers = await Promise.all([1, 2, 3].map(() => deliver(t.app, t.config, s.event)));
    expect(answers.map((r) => r.status)).toEqual([204, 204, 204]);
    expect(await rowsOf(s.event.id)).toBe(1);
    await expectInStepWithStripe(s);
    expect(await billingMail(s)).toEqual(expectedMail(type));
  });

  it('out-of-order pair: the later event first, then this one; the organisation ends as Stripe is now', async () => {
    const s = await scenario(type);
    expect((await deliver(t.app, t.config, s.later)).status).toBe(204);
    expect((await deliver(t.app, t.config, s.event)).status).toBe(204);
    await expectInStepWithStripe(s);
    expect(await rowsOf(s.event.id)).toBe(1);
    expect(await rowsOf(s.later.id)).toBe(1);
  });

  it('handler crash before the commit, then Stripe retries: exactly one effect', async () => {
    const s = await scenario(type);
    const before = await org(s.tenant.organisation.id);
    let crashes = 0;
    webhookFaults.afterEffect = () => {
      crashes += 1;
      throw new Error('crash in the middle of the handler');
    };
    const crashed = await deliver(t.app, t.config, s.event);
    expect(crashed.status).toBe(500);
    expect(crashes).toBe(1);
    await expectUnchanged(s, before);
    webhookFaults.afterEffect = null;
    expect((await deliver(t.app, t.config, s.event)).status).toBe(204);
    expect(await rowsOf(s.event.id)).toBe(1);
    await expectInStepWithStripe(s);
    expect(await billingMail(s)).toEqual(expectedMail(type));
  });
});
