/** POST /api/billing/change: another plan or interval for the running subscription; a smaller plan only within current usage. */
import { AppError } from '../../http/app-error.js';
import type { BillingContext } from './billing-context.js';
import { priceOnOffer } from './billing-view.js';
import { keepInStep, liveSubscription } from './live-subscription.js';
import { callStripe } from './stripe-client.js';
import { assertUsageFits } from './usage-fit.js';

export async function changePlan(ctx: BillingContext, organisationId: string, priceKey: string): Promise<void> {
  const price = priceOnOffer(await ctx.catalogue(), priceKey);
  const sub = await liveSubscription(ctx, organisationId);
  const item = sub.items.data[0];
  if (!item) throw new AppError(409, 'The subscription has no plan to change');
  if (item.price.id === price.priceId) throw new AppError(409, `The organisation is on this plan already`);
  await assertUsageFits(ctx.ds.manager, organisationId, price.plan);
  const readAt = new Date();
  const updated = await callStripe('subscription', () =>
    ctx.stripe.subscriptions.update(sub.id, { items: [{ id: item.id, price: price.priceId }], proration_behavior: 'create_prorations' }),
  );
  await keepInStep(ctx, organisationId, updated, readAt);
}
