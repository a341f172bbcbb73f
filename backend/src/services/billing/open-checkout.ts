/**
 * An open Checkout page and what it holds the organisation to. While a page for a plan may still be paid (Stripe
 * keeps a Checkout session for 24 hours; it is closed sooner when the subscription is applied or the session
 * expires), the organisation may hold no more than that plan allows, so paying never leaves it over its new plan.
 */
import { LIMIT_NAMES, type BillingOverLimit, type LimitName, type PlanLimits } from '@shared/schemas/billing.js';
import type { Organisation } from '../../entities/organisation.entity.js';
import { LIMIT_WORDS, planLifting, PLANS, type PlanDefinition } from './plan-catalogue.js';

/** How long a Checkout session can be paid after it is made (Stripe's default expiry). */
export const CHECKOUT_OPEN_MS = 24 * 3_600_000;

export const NO_OPEN_CHECKOUT = { checkoutPlan: null, checkoutStartedAt: null, checkoutSessionId: null } as const;

/** The plan of the organisation's open Checkout page, or null when none can still be paid. */
export function openCheckoutPlan(org: Organisation, now = new Date()): PlanDefinition | null {
  if (!org.checkoutPlan || !org.checkoutStartedAt) return null;
  if (now.getTime() - org.checkoutStartedAt.getTime() >= CHECKOUT_OPEN_MS) return null;
  return PLANS.find((p) => p.code === org.checkoutPlan) ?? null;
}

export const limitWords = (limit: LimitName, n: number) => `${n} ${n === 1 ? LIMIT_WORDS[limit].one : LIMIT_WORDS[limit].many}`;

/** Each limit the organisation holds more of than its plan allows, in plain words. */
export function overLimitOf(plan: PlanDefinition, usage: PlanLimits): BillingOverLimit[] {
  return LIMIT_NAMES.filter((limit) => usage[limit] > plan.limits[limit]).map((limit) => {
    const lifter = planLifting(limit, usage[limit] - 1);
    const allowed = plan.limits[limit];
    const next = lifter
      ? ` The ${lifter.name} plan allows ${limitWords(limit, lifter.limits[limit])}: an administrator can change the plan under Settings → Billing.`
      : ' No plan allows that many: write to us for a larger one.';
    return {
      limit,
      used: usage[limit],
      allowed,
      liftedBy: lifter?.name ?? null,
      message:
        `This organisation has ${limitWords(limit, usage[limit])} and the ${plan.name} plan allows ${allowed === 0 ? 'none' : allowed}. ` +
        `Nothing was deleted, but no more can be added until the plan allows them.${next}`,
    };
  });
}
