/**
 * Subscriptions against the local Stripe stand-in, through the API: a trial organisation subscribes on the
 * Checkout page, upgrades, downgrades within its usage, cancels at the period end and resumes; plans and
 * prices come from Stripe; a Stripe outage fails every billing action with a clear message and writes nothing.
 */
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { createTenant, CSRF, signedInAgent, type TenantFixture, uniqueEmail } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { deliver, deliverAll, eventsOf, fakeControl, payCheckout, stripeOf } from '../factories/billing.js';
import { BillingWebhookEvent } from '../../backend/src/entities/billing-webhook-event.entity.js';
import { sendTrialEndingMails } from '../../backend/src/services/billing/trial-ending-mails.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

const org = (id: string) => t.dataSource.getRepository(Organisation).findOneByOrFail({ id });

async function trialTenant(): Promise<{ tenant: TenantFixture; admin: TestAgent }> {
  const tenant = await createTenant(t.dataSource, 'billing');
  await t.dataSource.getRepository(Organisation).update({ id: tenant.organisation.id }, { trialEndsAt: new Date(Date.now() + 10 * 86_400_000) });
  return { tenant, admin: await signedInAgent(t.app, tenant.users.admin.email) };
}

describe('plans and the trial', () => {
  it('a self sign-up starts a 14-day trial without a card', async () => {
    const agent = request.agent(t.app);
    const email = uniqueEmail('trial');
    const res = await agent
      .post('/api/sign-up')
      .set(CSRF)
      .send({ name: 'Trial Person', email, password: 'a long and unusual passphrase', organisationName: 'Trial Utility' });
    expect(res.status).toBe(201);
    const created = await t.dataSource.getRepository(Organisation).findOneByOrFail({ name: 'Trial Utility' });
    const days = (created.trialEndsAt!.getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(13.9);
    expect(days).toBeLessThanOrEqual(14);
    expect(created).toMatchObject({ subscriptionStatus: 'trialing', stripeCustomerId: null, stripeSubscriptionId: null });
  });

  it('offers each plan monthly and yearly at the prices Stripe holds, found by lookup key', async () => {
    const { admin } = await trialTenant();
    const res = await admin.get('/api/billing');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'trialing', plan: { code: 'trial' }, trialDaysLeft: 10, readOnly: null, invoices: [], nextInvoice: null });
    expect(res.body.plans).toHaveLength(8);
    const stripe = stripeOf(t.config);
    const inStripe = await stripe.prices.list({ lookup_keys: res.body.plans.map((p: { price: string }) => p.price) });
    for (const offer of res.body.plans) {
      const price = inStripe.data.find((p) => p.lookup_key === offer.price)!;
      expect(price, offer.price).toBeDefined();
      expect(offer.amount).toBe((price.unit_amount! / 100).toFixed(2));
      expect(offer.interval).toBe(price.recurring!.interval);
    }
    expect(res.body.usage.map((u: { limit: string }) => u.limit)).toEqual(['units', 'clientGroups', 'seats']);
  });

  it('refuses a price that is not on offer, and writes nothing', async () => {
    const { tenant, admin } = await trialTenant();
    const res = await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_gold_month' });
    expect(res.status).toBe(400);
    expect((await org(tenant.organisation.id)).stripeCustomerId).toBeNull();
  });
});

describe('a trial organisation through checkout, change and cancel', () => {
  it('subscribes, upgrades, downgrades within its usage, cancels at the period end and resumes', async () => {
    const { tenant, admin } = await trialTenant();
    const id = tenant.organisation.id;
    const plant = await createPlant(t.dataSource, id);
    for (let i = 0; i < 3; i++) await createUnit(t.dataSource, plant);

    // Three units do not fit the Plant plan (2): refused before anything is made in Stripe.
    const tooSmall = await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_plant_month' });
    expect(tooSmall.status).toBe(409);
    expect(tooSmall.body.error).toMatch(/3 units \(the Plant plan allows 2\)/);

    const { url } = await payCheckout(admin, 'cleancase_station_month');
    expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\//);
    // Until Stripe's events arrive, nothing says the organisation paid.
    expect((await org(id)).subscriptionStatus).toBe('trialing');
    const events = await deliverAll(t.app, t.config, t.dataSource, id);
    expect(events.map((e) => e.type)).toEqual(['checkout.session.completed', 'customer.subscription.created', 'invoice.paid']);

    let view = (await admin.get('/api/billing')).body;
    expect(view).toMatchObject({
      status: 'active',
      plan: { code: 'station', name: 'Station' },
      interval: 'month',
      trialDaysLeft: null,
      cancelAtPeriodEnd: false,
    });
    expect(view.usage.find((u: { limit: string }) => u.limit === 'units')).toEqual({ limit: 'units', label: 'units', used: 3, allowed: 10 });
    expect(view.invoices).toHaveLength(1);
    expect(view.invoices[0]).toMatchObject({ status: 'paid', amount: '690.00' });
    expect(view.nextInvoice).toMatchObject({ amount: '690.00', currency: 'usd' });
    const receipts = await t.mailTo(tenant.users.admin.email);
    expect(receipts.filter((m) => m.subject.startsWith('Receipt'))).toHaveLength(1);
    expect(receipts.find((m) => m.subject.startsWith('Receipt'))!.text).toContain('Thank you: $690.00 for');

    // Upgrade to Fleet yearly.
    expect((await admin.post('/api/billing/change').set(CSRF).send({ price: 'cleancase_fleet_year' })).status).toBe(204);
    view = (await admin.get('/api/billing')).body;
    expect(view).toMatchObject({ plan: { code: 'fleet' }, interval: 'year', price: 'cleancase_fleet_year' });
    const sub = await stripeOf(t.config).subscriptions.retrieve((await org(id)).stripeSubscriptionId!);
    expect(sub.items.data[0]!.price.lookup_key).toBe('cleancase_fleet_year');

    // Down to Plant: three units do not fit; to Station they do.
    const down = await admin.post('/api/billing/change').set(CSRF).send({ price: 'cleancase_plant_year' });
    expect(down.status).toBe(409);
    expect((await org(id)).plan).toBe('fleet');
    expect((await admin.post('/api/billing/change').set(CSRF).send({ price: 'cleancase_station_year' })).status).toBe(204);
    expect((await org(id)).plan).toBe('station');

    // Cancel at the period end: still active, no next invoice; then resume.
    expect((await admin.post('/api/billing/cancel').set(CSRF)).status).toBe(204);
    view = (await admin.get('/api/billing')).body;
    expect(view).toMatchObject({ status: 'active', cancelAtPeriodEnd: true, nextInvoice: null, readOnly: null });
    expect((await admin.post('/api/billing/resume').set(CSRF)).status).toBe(204);
    expect((await org(id)).cancelAtPeriodEnd).toBe(false);

    // Checkout again while subscribed: change the plan instead.
    expect((await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_fleet_month' })).status).toBe(409);

    // The portal opens on the stand-in's page.
    const portal = await admin.post('/api/billing/portal').set(CSRF);
    expect(portal.status).toBe(200);
    expect(portal.body.url).toMatch(/\/portal\/bps_/);

    // Cancelled at the period end, and the period ends: read-only, nothing deleted.
    await admin.post('/api/billing/cancel').set(CSRF);
    await fakeControl(t.config, `subscriptions/${(await org(id)).stripeSubscriptionId}/renew`);
    await deliverAll(t.app, t.config, t.dataSource, id);
    view = (await admin.get('/api/billing')).body;
    expect(view.status).toBe('canceled');
    expect(view.readOnly).toMatch(/read-only/);
    const refused = await admin.post(`/api/plants/${plant.id}/units`).set(CSRF).send({ name: 'One more' });
    expect(refused.status).toBe(402);
    expect(refused.body.error).toMatch(/subscription has ended/);
    expect((await admin.get(`/api/plants/${plant.id}`)).status).toBe(200);

    // Paying again restores writing.
    await payCheckout(admin, 'cleancase_station_month');
    await deliverAll(t.app, t.config, t.dataSource, id);
    expect((await org(id)).subscriptionStatus).toBe('active');
    expect((await admin.post(`/api/plants/${plant.id}/units`).set(CSRF).send({ name: 'One more' })).status).toBe(201);
  });
});

describe('when Stripe is down or failing', () => {
  it('answers 503 with a clear message for each billing action and writes nothing', async () => {
    const { tenant, admin } = await trialTenant();
    const before = await org(tenant.organisation.id);
    await admin.get('/api/billing'); // the catalogue is read while Stripe answers
    for (const [path, body] of [
      ['/api/billing/checkout', { price: 'cleancase_station_month' }],
      ['/api/billing/portal', undefined],
    ] as const) {
      await fakeControl(t.config, 'fail-next', { count: '1', status: '500', match: tenant.organisation.id });
      const res = await admin.post(path).set(CSRF).send(body);
      expect(res.status, path).toBe(503);
      expect(res.body.error).toMatch(/payment service \(Stripe\) is not answering just now, so nothing was changed/);
      expect(JSON.stringify(res.body)).not.toMatch(/stack|at .*\.js/);
    }
    expect(await org(tenant.organisation.id)).toEqual(before);
  });

  it('a Checkout page Stripe did not make holds the organisation to nothing; an earlier page still open holds again', async () => {
    const { tenant, admin } = await trialTenant();
    const id = tenant.organisation.id;
    const plant = await createPlant(t.dataSource, id);
    await createUnit(t.dataSource, plant);
    await createUnit(t.dataSource, plant);
    // Only the session call fails (the customer is made): no page, so the Plant plan's 2 units do not hold.
    await fakeControl(t.config, 'fail-next', { count: '1', status: '500', match: `"client_reference_id":"${id}"` });
    expect((await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_plant_month' })).status).toBe(503);
    expect(await org(id)).toMatchObject({ checkoutPlan: null, checkoutStartedAt: null, checkoutSessionId: null });
    expect((await admin.post(`/api/plants/${plant.id}/units`).set(CSRF).send({ name: 'Third' })).status).toBe(201);

    // A Station page is given; a later Fleet page fails: the Station page (still payable) holds as before.
    expect((await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_station_month' })).status).toBe(200);
    const station = await org(id);
    expect(station).toMatchObject({ checkoutPlan: 'station' });
    expect(station.checkoutSessionId).toMatch(/^cs_/);
    await fakeControl(t.config, 'fail-next', { count: '1', status: '500', match: `"client_reference_id":"${id}"` });
    expect((await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_fleet_month' })).status).toBe(503);
    expect(await org(id)).toMatchObject({
      checkoutPlan: 'station',
      checkoutStartedAt: station.checkoutStartedAt,
      checkoutSessionId: station.checkoutSessionId,
    });
  });

  it('with nothing listening where Stripe should be, billing says so and the rest of the product works', async () => {
    const down = await createTestApp({ STRIPE_API_BASE: 'http://127.0.0.1:9' });
    try {
      const tenant = await createTenant(down.dataSource, 'nostripe');
      const admin = await signedInAgent(down.app, tenant.users.admin.email);
      const res = await admin.get('/api/billing');
      expect(res.status).toBe(503);
      expect(res.body.error).toMatch(/Stripe/);
      const checkout = await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_station_month' });
      expect(checkout.status).toBe(503);
      expect((await down.dataSource.getRepository(Organisation).findOneByOrFail({ id: tenant.organisation.id })).stripeCustomerId).toBeNull();
      expect((await admin.get('/api/plants')).status).toBe(200);
    } finally {
      await down.close();
    }
  });

  it('a webhook that cannot re-read the subscription answers 503 and stores nothing; Stripe’s retry then applies it once', async () => {
    const { tenant, admin } = await trialTenant();
    await payCheckout(admin, 'cleancase_station_month');
    const customer = (await org(tenant.organisation.id)).stripeCustomerId!;
    const created = (await eventsOf(t.config, customer)).find((e) => e.type === 'customer.subscription.created')!;
    await fakeControl(t.config, 'fail-next', { count: '1', status: '500', match: (created.data.object as { id: string }).id });
    const failed = await deliver(t.app, t.config, created);
    expect(failed.status).toBe(503);
    expect(await t.dataSource.getRepository(BillingWebhookEvent).countBy({ id: created.id })).toBe(0);
    expect((await org(tenant.organisation.id)).subscriptionStatus).toBe('trialing');
    expect((await deliver(t.app, t.config, created)).status).toBe(204);
    expect((await org(tenant.organisation.id)).subscriptionStatus).toBe('active');
  });
});

describe('trial-ending mail', () => {
  it('goes once to each administrator of a trial in its last three days, and not to a trial with longer to run', async () => {
    const ending = await createTenant(t.dataSource, 'ending');
    const later = await createTenant(t.dataSource, 'later');
    await t.dataSource.getRepository(Organisation).update({ id: ending.organisation.id }, { trialEndsAt: new Date(Date.now() + 2 * 86_400_000) });
    await t.dataSource.getRepository(Organisation).update({ id: later.organisation.id }, { trialEndsAt: new Date(Date.now() + 9 * 86_400_000) });
    await sendTrialEndingMails(t.dataSource, t.config);
    await sendTrialEndingMails(t.dataSource, t.config);
    const mails = (await t.mailTo(ending.users.admin.email)).filter((m) => m.subject.startsWith('The Cleancase trial'));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toMatch(/Nothing is deleted when a trial ends/);
    expect((await t.mailTo(ending.users.analyst.email)).filter((m) => m.subject.startsWith('The Cleancase trial'))).toHaveLength(0);
    expect((await t.mailTo(later.users.admin.email)).filter((m) => m.subject.startsWith('The Cleancase trial'))).toHaveLength(0);
  });
});
