/**
 * The demo's subscriptions. The two demo organisations are subscribed through Stripe (the local stand-in:
 * no card, no money) so the demo never lapses into read-only; one more fictional organisation is on a
 * trial in its last days, to show the trial banner and the way to a plan.
 */
import type { DataSource } from 'typeorm';
import { hashPassword } from '../auth/password.js';
import { Membership } from '../entities/membership.entity.js';
import { Organisation } from '../entities/organisation.entity.js';
import { User } from '../entities/user.entity.js';
import type { BillingContext } from '../services/billing/billing-context.js';
import { applySubscription, lockOrganisation } from '../services/billing/organisation-billing.js';
import { ensureCustomer } from '../services/billing/start-checkout.js';
import { usesLocalStripe } from '../services/billing/stripe-client.js';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD } from './demo-people.js';
import { seedTypicalMethods } from '../services/cleaning-method.service.js';

/** The organisation on a trial: its administrator signs in with the demo password. */
export const DEMO_TRIAL = {
  organisation: 'Fenwick Bay Generating',
  admin: { email: 'admin@fenwickbay.example', name: 'Oluwaseun Brandt' },
  daysLeft: 2,
};

/** Demo organisation → the plan it is on (by lookup key). */
const DEMO_PLANS: Record<string, string> = { utility: 'cleancase_fleet_year', consultancy: 'cleancase_consultancy_year' };

export async function seedDemoTrial(ds: DataSource, now = new Date()): Promise<Organisation> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return ds.transaction(async (em) => {
    const org = await em.getRepository(Organisation).save({
      name: DEMO_TRIAL.organisation,
      kind: 'utility',
      plan: 'trial',
      subscriptionStatus: 'trialing',
      // Two days and an hour: "2 days left" for the whole demo day.
      trialEndsAt: new Date(now.getTime() + DEMO_TRIAL.daysLeft * 86_400_000 - 3_600_000),
    });
    await seedTypicalMethods(em, org.id);
    const user = await em
      .getRepository(User)
      .save({ email: DEMO_TRIAL.admin.email, name: DEMO_TRIAL.admin.name, passwordHash, unitPreference: 'us', emailProvenAt: new Date() });
    await em.getRepository(Membership).save({ organisationId: org.id, userId: user.id, role: 'admin', clientGroupIds: null });
    return org;
  });
}

/** Subscribes each demo organisation to its plan through the local Stripe stand-in (never against real Stripe). */
export async function subscribeDemoOrganisations(ctx: BillingContext, log: (line: string) => void): Promise<void> {
  if (!usesLocalStripe(ctx.config)) {
    log('Demo organisations stay on their trial: real Stripe is configured, and the demo never subscribes there');
    return;
  }
  const catalogue = await ctx.catalogue();
  for (const demo of DEMO_ORGANISATIONS) {
    const org = await ctx.ds.getRepository(Organisation).findOneBy({ name: demo.name });
    const price = catalogue.get(DEMO_PLANS[demo.key] ?? '');
    if (!org || !price || org.stripeSubscriptionId) continue;
    const customer = await ensureCustomer(ctx, org.id);
    const readAt = new Date();
    const sub = await ctx.stripe.subscriptions.create({ customer, items: [{ price: price.priceId }], metadata: { organisationId: org.id } });
    await ctx.ds.transaction(async (em) => applySubscription(em, await lockOrganisation(em, org.id), sub, readAt));
    log(`Demo: ${demo.name} on the ${price.plan.name} plan (${price.interval}ly) through the Stripe stand-in`);
  }
}

export async function seedDemoBilling(ctx: BillingContext, log: (line: string) => void): Promise<void> {
  await seedDemoTrial(ctx.ds);
  try {
    await subscribeDemoOrganisations(ctx, log);
  } catch (err) {
    log(`Demo subscriptions not made (${err instanceof Error ? err.message : String(err)}): the demo organisations stay on their trial`);
  }
}
