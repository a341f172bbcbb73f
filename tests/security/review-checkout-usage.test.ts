/**
 * Security review: an organisation never ends up paying for less than it holds without being told, and cannot add
 * more while it does. (1) While a Checkout page for a plan is open, additions are held to the smaller of the current
 * plan's limits and that plan's (plan-limits.ts assertWithinPlanLimit, under the organisation's row lock), so paying
 * it cannot leave the organisation over its new plan. (2) When a paid plan is nevertheless applied below usage (a
 * plan changed in Stripe's portal, or a race), nothing is deleted or silently upgraded: the billing page and every
 * member's notice say so in plain words, and additions are refused until the plan fits.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import { Organisation } from '../../backend/src/entities/organisation.entity.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { deliver, deliverAll, payCheckout, stripeOf } from '../factories/billing.js';
import { createPlant, createUnit } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import type Stripe from 'stripe';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

async function trialTenant(label: string) {
  const tenant = await createTenant(t.dataSource, label);
  const id = tenant.organisation.id;
  await t.dataSource.getRepository(Organisation).update({ id }, { trialEndsAt: new Date(Date.now() + 10 * 86_400_000) });
  return { tenant, id, admin: await signedInAgent(t.app, tenant.users.admin.email) };
}

const addUnit = (agent: Awaited<ReturnType<typeof signedInAgent>>, plantId: string, name: string) =>
  agent.post(`/api/plants/${plantId}/units`).set(CSRF).send({ name });

const units = (organisationId: string) => t.dataSource.getRepository(GeneratingUnit).countBy({ organisationId });

describe('a paid plan never starts below the usage it is paid for', () => {
  it('while a Checkout page for the Plant plan is open, a third unit is refused naming the limit, the open checkout and the plan that lifts it', async () => {
    const { id, admin } = await trialTenant('review-checkout');

    // 1. While empty, the Plant plan (2 units) fits: the Checkout page is given.
    const checkout = await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_plant_month' });
    expect(checkout.status).toBe(200);

    // 2. Still on the trial (Consultancy limits, 40 units), but the open page holds the organisation to the Plant plan's 2.
    const plant = await createPlant(t.dataSource, id);
    expect((await addUnit(admin, plant.id, 'Filled 0')).status).toBe(201);
    expect((await addUnit(admin, plant.id, 'Filled 1')).status).toBe(201);
    const third = await addUnit(admin, plant.id, 'Filled 2');
    expect(third.status).toBe(402);
    expect(third.body.error).toMatch(/checkout for the Plant plan is open/);
    expect(third.body.error).toMatch(/2 units, and it has 2/);
    expect(third.body.error).toMatch(/The Station plan allows 10 units/);
    expect(await units(id)).toBe(2);
    const open = (await admin.get('/api/billing')).body;
    expect(open.openCheckout).toMatchObject({ plan: 'plant', name: 'Plant' });
    expect(new Date(open.openCheckout.until).getTime() - Date.now()).toBeGreaterThan(23 * 3_600_000);

    // 3. The page is paid and Stripe's events arrive: the Plant plan holds all the organisation has.
    const paid = await fetch(checkout.body.url as string, { method: 'POST', body: new URLSearchParams({ outcome: 'pay' }), redirect: 'manual' });
    expect(paid.status).toBe(303);
    await deliverAll(t.app, t.config, t.dataSource, id);

    const org = await t.dataSource.getRepository(Organisation).findOneByOrFail({ id });
    expect(org.plan).toBe('plant');
    expect(org.checkoutPlan).toBeNull();
    expect(await units(id)).toBe(2);
    const view = (await admin.get('/api/billing')).body;
    expect((view.usage as { used: number; allowed: number }[]).filter((u) => u.used > u.allowed)).toEqual([]);
    expect(view.overLimit).toEqual([]);
    expect(view.openCheckout).toBeNull();
    expect((await admin.get('/api/billing/notice')).body.overLimit).toBeNull();
  });

  it('an expired Checkout page stops holding the organisation to its plan; one made more than 24 hours ago no longer counts', async () => {
    const { id, admin } = await trialTenant('review-expired');
    const checkout = await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_plant_month' });
    expect(checkout.status).toBe(200);
    const plant = await createPlant(t.dataSource, id);
    await createUnit(t.dataSource, plant);
    await createUnit(t.dataSource, plant);
    expect((await addUnit(admin, plant.id, 'Held')).status).toBe(402);

    // Stripe says the session expired (no payment can follow): the trial's own limits apply again.
    const org = await t.dataSource.getRepository(Organisation).findOneByOrFail({ id });
    const session = await stripeOf(t.config).checkout.sessions.retrieve(org.checkoutSessionId!);
    const event = {
      id: `evt_review_expired_${id.slice(0, 8)}`,
      object: 'event',
      type: 'checkout.session.expired',
      created: Math.floor(Date.now() / 1000),
      data: { object: { ...session, status: 'expired' } },
    } as unknown as Stripe.Event;
    expect((await deliver(t.app, t.config, event)).status).toBe(204);
    expect((await addUnit(admin, plant.id, 'After expiry')).status).toBe(201);

    // A second page, asked for 25 hours ago, is past Stripe's 24 hours: it holds nothing.
    expect((await admin.post('/api/billing/checkout').set(CSRF).send({ price: 'cleancase_station_month' })).status).toBe(200);
    await t.dataSource.getRepository(Organisation).update({ id }, { checkoutPlan: 'plant', checkoutStartedAt: new Date(Date.now() - 25 * 3_600_000) });
    expect((await addUnit(admin, plant.id, 'After a day')).status).toBe(201);
    expect(await units(id)).toBe(4);
  });

  it('a plan changed in Stripe below usage deletes nothing: the billing page and every member are told, and additions are refused until the plan fits', async () => {
    const { tenant, id, admin } = await trialTenant('review-portal');
    const viewer = await signedInAgent(t.app, tenant.users.viewer.email);
    const plant = await createPlant(t.dataSource, id);
    for (let i = 0; i < 5; i++) await createUnit(t.dataSource, plant);

    // Five units on the Station plan (10).
    await payCheckout(admin, 'cleancase_station_month');
    await deliverAll(t.app, t.config, t.dataSource, id);
    expect((await t.dataSource.getRepository(Organisation).findOneByOrFail({ id })).plan).toBe('station');

    // The plan is moved to Plant (2 units) in Stripe itself, past our checks, and the event arrives.
    const stripe = stripeOf(t.config);
    const subId = (await t.dataSource.getRepository(Organisation).findOneByOrFail({ id })).stripeSubscriptionId!;
    const sub = await stripe.subscriptions.retrieve(subId);
    const plantPrice = (await stripe.prices.list({ lookup_keys: ['cleancase_plant_month'] })).data[0]!;
    await stripe.subscriptions.update(subId, { items: [{ id: sub.items.data[0]!.id, price: plantPrice.id }] });
    await deliverAll(t.app, t.config, t.dataSource, id);

    // Applied as Stripe says, nothing deleted, nothing upgraded behind the organisation's back.
    const org = await t.dataSource.getRepository(Organisation).findOneByOrFail({ id });
    expect(org.plan).toBe('plant');
    expect(org.priceLookupKey).toBe('cleancase_plant_month');
    expect(await units(id)).toBe(5);

    const view = (await admin.get('/api/billing')).body;
    expect(view.usage.find((u: { limit: string }) => u.limit === 'units')).toMatchObject({ used: 5, allowed: 2 });
    expect(view.overLimit).toHaveLength(1);
    expect(view.overLimit[0]).toMatchObject({ limit: 'units', used: 5, allowed: 2, liftedBy: 'Station' });
    expect(view.overLimit[0].message).toMatch(/has 5 units and the Plant plan allows 2\. Nothing was deleted, but no more can be added/);

    // Every member's banner says it, not only the administrator's billing page.
    const notice = (await viewer.get('/api/billing/notice')).body;
    expect(notice.overLimit).toBe(view.overLimit[0].message);

    // Additions are refused while over, naming the plan that lifts the limit.
    const refused = await addUnit(admin, plant.id, 'One more');
    expect(refused.status).toBe(402);
    expect(refused.body.error).toMatch(/The Plant plan allows 2 units and this organisation has 5\. The Station plan allows 10 units/);
    expect(await units(id)).toBe(5);

    // Once the plan fits again, the notice goes and additions are allowed.
    expect((await admin.post('/api/billing/change').set(CSRF).send({ price: 'cleancase_station_month' })).status).toBe(204);
    await deliverAll(t.app, t.config, t.dataSource, id);
    expect((await viewer.get('/api/billing/notice')).body.overLimit).toBeNull();
    expect((await admin.get('/api/billing')).body.overLimit).toEqual([]);
    expect((await addUnit(admin, plant.id, 'Fits again')).status).toBe(201);
  });
});
