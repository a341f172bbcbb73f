/** GET /api/billing: plan, status, trial, usage against each limit, next invoice, invoices and the plans on offer. */
import { LIMIT_NAMES, type BillingOverview } from '@shared/schemas/billing.js';
import { readOnlyReason, trialDaysLeft } from '@shared/billing-access.js';
import type { BillingContext } from './billing-context.js';
import { money, offers } from './billing-view.js';
import { currentPlan, usageOf } from './organisation-billing.js';
import { CHECKOUT_OPEN_MS, openCheckoutPlan, overLimitOf } from './open-checkout.js';
import { LIMIT_WORDS, planOfLookupKey } from './plan-catalogue.js';
import { Organisation } from '../../entities/organisation.entity.js';
import { callStripe } from './stripe-client.js';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export async function getBillingOverview(ctx: BillingContext, organisationId: string, now = new Date()): Promise<BillingOverview> {
  const catalogue = await ctx.catalogue();
  const org = await ctx.ds.getRepository(Organisation).findOneByOrFail({ id: organisationId });
  const plan = currentPlan(org);
  const usage = await usageOf(ctx.ds.manager, organisationId);
  const checkout = openCheckoutPlan(org, now);
  const invoices = org.stripeCustomerId
    ? (await callStripe('customer', () => ctx.stripe.invoices.list({ customer: org.stripeCustomerId!, limit: 12 }))).data
    : [];
  const price = org.priceLookupKey ? catalogue.get(org.priceLookupKey) : undefined;
  const billsNext = !!price && !org.cancelAtPeriodEnd && !!org.currentPeriodEnd && ['active', 'past_due', 'trialing'].includes(org.subscriptionStatus);
  return {
    plan: { code: plan.code, name: plan.name },
    status: org.subscriptionStatus,
    price: org.priceLookupKey,
    interval: planOfLookupKey(org.priceLookupKey)?.interval ?? null,
    trialEndsAt: org.stripeSubscriptionId ? null : iso(org.trialEndsAt),
    trialDaysLeft: org.stripeSubscriptionId ? null : trialDaysLeft(org, now),
    currentPeriodEnd: iso(org.currentPeriodEnd),
    cancelAtPeriodEnd: org.cancelAtPeriodEnd,
    readOnly: readOnlyReason(org, now),
    usage: LIMIT_NAMES.map((limit) => ({ limit, label: LIMIT_WORDS[limit].many, used: usage[limit], allowed: plan.limits[limit] })),
    overLimit: overLimitOf(plan, usage),
    openCheckout: checkout
      ? { plan: checkout.code, name: checkout.name, until: new Date(org.checkoutStartedAt!.getTime() + CHECKOUT_OPEN_MS).toISOString() }
      : null,
    nextInvoice: billsNext ? { date: org.currentPeriodEnd!.toISOString(), amount: money(price.cents), currency: price.currency } : null,
    invoices: invoices.map((i) => ({
      id: i.id ?? '',
      number: i.number ?? null,
      date: new Date(i.created * 1000).toISOString(),
      amount: money(i.total),
      currency: i.currency,
      status: i.status ?? 'draft',
      url: i.hosted_invoice_url ?? null,
    })),
    plans: offers(catalogue),
  };
}
