/**
 * POST /api/billing/checkout: the address of Stripe's Checkout page for a plan. The Stripe customer is made
 * once per organisation (an idempotency key makes a retry return the same one) and its id saved before the
 * session is asked for, so a failure at any step leaves nothing half-made.
 */
import { Organisation } from '../../entities/organisation.entity.js';
import { AppError } from '../../http/app-error.js';
import { baseUrl } from '../../http/base-url.js';
import type { BillingContext } from './billing-context.js';
import { adminAddresses, priceOnOffer } from './billing-view.js';
import { lockOrganisation } from './organisation-billing.js';
import { callStripe } from './stripe-client.js';
import { assertUsageFits } from './usage-fit.js';

const LIVE = ['active', 'past_due', 'trialing'];

export async function ensureCustomer(ctx: BillingContext, organisationId: string): Promise<string> {
  const org = await ctx.ds.getRepository(Organisation).findOneByOrFail({ id: organisationId });
  if (org.stripeCustomerId) return org.stripeCustomerId;
  const admin = (await adminAddresses(ctx.ds.manager, organisationId))[0];
  const customer = await callStripe('customer', () =>
    ctx.stripe.customers.create(
      { name: org.name, email: admin?.email, metadata: { organisationId } },
      { idempotencyKey: `cleancase-customer-${organisationId}` },
    ),
  );
  return ctx.ds.transaction(async (em) => {
    const locked = await lockOrganisation(em, organisationId);
    if (locked.stripeCustomerId) return locked.stripeCustomerId;
    await em.getRepository(Organisation).update({ id: organisationId }, { stripeCustomerId: customer.id });
    return customer.id;
  });
}

export async function startCheckout(ctx: BillingContext, organisationId: string, priceKey: string): Promise<{ url: string }> {
  const price = priceOnOffer(await ctx.catalogue(), priceKey);
  const org = await ctx.ds.getRepository(Organisation).findOneByOrFail({ id: organisationId });
  if (org.stripeSubscriptionId && LIVE.includes(org.subscriptionStatus)) {
    throw new AppError(409, 'This organisation has a subscription already: change its plan instead');
  }
  await assertUsageFits(ctx.ds.manager, organisationId, price.plan);
  const customer = await ensureCustomer(ctx, organisationId);
  // Under the lock that additions take, usage is checked once more and the plan asked for is written down: from
  // here on additions are held to that plan's limits too (plan-limits.ts), so nothing slips in before it is paid.
  const { startedAt, before } = await ctx.ds.transaction(async (em) => {
    const locked = await lockOrganisation(em, organisationId);
    await assertUsageFits(em, organisationId, price.plan);
    const previous = { checkoutPlan: locked.checkoutPlan, checkoutStartedAt: locked.checkoutStartedAt, checkoutSessionId: locked.checkoutSessionId };
    const at = new Date();
    await em.getRepository(Organisation).update({ id: organisationId }, { checkoutPlan: price.plan.code, checkoutStartedAt: at, checkoutSessionId: null });
    return { startedAt: at, before: previous };
  });
  const back = `${baseUrl(ctx.config)}/settings/billing`;
  try {
    const session = await callStripe('customer', () =>
      ctx.stripe.checkout.sessions.create({
        mode: 'subscription',
        customer,
        client_reference_id: organisationId,
        line_items: [{ price: price.priceId, quantity: 1 }],
        subscription_data: { metadata: { organisationId } },
        success_url: `${back}?checkout=done`,
        cancel_url: back,
      }),
    );
    if (!session.url) throw new AppError(503, 'Stripe gave no checkout page: nothing was changed. Try again in a few minutes.');
    await ctx.ds.getRepository(Organisation).update({ id: organisationId, checkoutStartedAt: startedAt }, { checkoutSessionId: session.id });
    return { url: session.url };
  } catch (err) {
    // No page to pay: the limits it set go with it, and an earlier page still open holds again (unless a newer request has written its own since).
    await ctx.ds.getRepository(Organisation).update({ id: organisationId, checkoutStartedAt: startedAt }, before);
    throw err;
  }
}
