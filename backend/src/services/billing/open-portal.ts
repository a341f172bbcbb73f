/** POST /api/billing/portal: the address of Stripe's billing portal (card, invoices) for the organisation's customer. */
import { baseUrl } from '../../http/base-url.js';
import type { BillingContext } from './billing-context.js';
import { ensureCustomer } from './start-checkout.js';
import { callStripe } from './stripe-client.js';

export async function openPortal(ctx: BillingContext, organisationId: string): Promise<{ url: string }> {
  const customer = await ensureCustomer(ctx, organisationId);
  const session = await callStripe('customer', () =>
    ctx.stripe.billingPortal.sessions.create({ customer, return_url: `${baseUrl(ctx.config)}/settings/billing` }),
  );
  return { url: session.url };
}
