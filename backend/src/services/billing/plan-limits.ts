/**
 * Plan limits, checked on the server inside the transaction that adds the record: the organisation's row is
 * locked first, so two requests for the last slot take turns and exactly one of them gets it.
 */
import type { EntityManager } from 'typeorm';
import type { LimitName } from '@shared/schemas/billing.js';
import { AppError } from '../../http/app-error.js';
import { currentPlan, lockOrganisation, usageOf } from './organisation-billing.js';
import { LIMIT_WORDS, planLifting } from './plan-catalogue.js';

const words = (limit: LimitName, n: number) => `${n} ${n === 1 ? LIMIT_WORDS[limit].one : LIMIT_WORDS[limit].many}`;

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

/** Call first in the transaction that adds `adding` of `limit` (before any insert, so the lock order is always the same). */
export async function assertWithinPlanLimit(em: EntityManager, organisationId: string, limit: LimitName, adding = 1): Promise<void> {
  const org = await lockOrganisation(em, organisationId);
  const plan = currentPlan(org);
  const used = (await usageOf(em, organisationId))[limit];
  if (used + adding > plan.limits[limit]) throw new AppError(402, limitMessage(plan.name, limit, plan.limits[limit], used), { limit, plan: plan.code });
}
