/** The organisation's running subscription as Stripe has it now, or a clear refusal when there is none. */
import type Stripe from 'stripe';
import { Organisation } from '../../entities/organisation.entity.js';
import { AppError } from '../../http/app-error.js';
import type { BillingContext } from './billing-context.js';
import { applySubscription, lockOrganisation } from './organisation-billing.js';
import { callStripe } from './stripe-client.js';

export async function liveSubscription(ctx: BillingContext, organisationId: string): Promise<Stripe.Subscription> {
  const org = await ctx.ds.getRepository(Organisation).findOneByOrFail({ id: organisationId });
  if (!org.stripeSubscriptionId) throw new AppError(409, 'This organisation has no subscription yet: choose a plan first');
  const sub = await callStripe('subscription', () => ctx.stripe.subscriptions.retrieve(org.stripeSubscriptionId!));
  if (sub.status === 'canceled') throw new AppError(409, 'The subscription has ended: choose a plan to start a new one');
  return sub;
}

/** Writes what Stripe answered onto the organisation now, so the page shows it at once (the webhook writes the same later). */
export async function keepInStep(ctx: BillingContext, organisationId: string, sub: Stripe.Subscription, readAt: Date): Promise<void> {
  await ctx.ds.transaction(async (em) => applySubscription(em, await lockOrganisation(em, organisationId), sub, readAt));
}
