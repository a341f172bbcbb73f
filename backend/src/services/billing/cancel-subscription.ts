/** POST /api/billing/cancel ends the subscription at the end of the paid period; POST /api/billing/resume keeps it after all. */
import type { BillingContext } from './billing-context.js';
import { keepInStep, liveSubscription } from './live-subscription.js';
import { callStripe } from './stripe-client.js';

export async function setCancelAtPeriodEnd(ctx: BillingContext, organisationId: string, cancel: boolean): Promise<void> {
  const sub = await liveSubscription(ctx, organisationId);
  const readAt = new Date();
  const updated = await callStripe('subscription', () => ctx.stripe.subscriptions.update(sub.id, { cancel_at_period_end: cancel }));
  await keepInStep(ctx, organisationId, updated, readAt);
}
