/**
 * Plan limits, checked on the server inside the transaction that adds the record: the organisation's row is
 * locked first, so two requests for the last slot take turns and exactly one of them gets it. While a Checkout
 * page for a plan is open, that plan's limits apply too (the smaller of the two), so paying it never leaves the
 * organisation holding more than it pays for.
 */
import type { EntityManager } from 'typeorm';
import type { LimitName } from '@shared/schemas/billing.js';
import { AppError } from '../../http/app-error.js';
import { currentPlan, lockOrganisation, usageOf } from './organisation-billing.js';
import { limitWords, openCheckoutPlan } from './open-checkout.js';
import { LIMIT_WORDS, planLifting, type PlanDefinition } from './plan-catalogue.js';

const words = limitWords;

/** The message naming the limit and the plan that lifts it. */
export function limitMessage(planName: string, limit: LimitName, allowed: number, used: number): string {
  const lifter = planLifting(limit, Math.max(allowed, used));
  const head =
    allowed === 0
      ? `The ${planName} plan has no ${LIMIT_WORDS[limit].many}.`
      : `The ${planName} plan allows ${words(limit, allowed)} and this organisation has ${used}.`;
  const next = lifter
    ? ` The ${lifter.name} plan allows ${words(limit, lifter.limits[limit])}: an administrator can change the plan under Settings → Billing.`
    : ' No plan allows more: write to us for a larger one.';
  return head + next;
}

/** The message when an open Checkout page's plan is the smaller limit. */
export function checkoutLimitMessage(planName: string, checkout: PlanDefinition, limit: LimitName, used: number): string {
  const allowed = checkout.limits[limit];
  const lifter = planLifting(limit, Math.max(allowed, used));
  const head =
    `A checkout for the ${checkout.name} plan is open, so until it is paid or expires (within 24 hours) this organisation can hold ` +
    `no more than that plan allows: ${allowed === 0 ? `no ${LIMIT_WORDS[limit].many}` : words(limit, allowed)}, and it has ${used} (the ${planName} plan alone would allow more).`;
  const next = lifter
    ? ` The ${lifter.name} plan allows ${words(limit, lifter.limits[limit])}: an administrator can ask for its checkout instead under Settings → Billing.`
    : ' No plan allows more: write to us for a larger one.';
  return head + next;
}

/** Call first in the transaction that adds `adding` of `limit` (before any insert, so the lock order is always the same). */
export async function assertWithinPlanLimit(em: EntityManager, organisationId: string, limit: LimitName, adding = 1): Promise<void> {
  const org = await lockOrganisation(em, organisationId);
  const plan = currentPlan(org);
  const used = (await usageOf(em, organisationId))[limit];
  if (used + adding > plan.limits[limit]) throw new AppError(402, limitMessage(plan.name, limit, plan.limits[limit], used), { limit, plan: plan.code });
  const checkout = openCheckoutPlan(org);
  if (checkout && used + adding > checkout.limits[limit]) {
    throw new AppError(402, checkoutLimitMessage(plan.name, checkout, limit, used), { limit, plan: plan.code, checkoutPlan: checkout.code });
  }
}
