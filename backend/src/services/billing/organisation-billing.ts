/** The organisation's row as the billing code reads and writes it: locked, counted, and kept in step with Stripe. */
import type Stripe from 'stripe';
import type { EntityManager } from 'typeorm';
import type { LimitName, PlanLimits } from '@shared/schemas/billing.js';
import { ClientGroup } from '../../entities/client-group.entity.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { Invitation } from '../../entities/invitation.entity.js';
import { Membership } from '../../entities/membership.entity.js';
import { Organisation, type SubscriptionStatus } from '../../entities/organisation.entity.js';
import { notFound } from '../../http/app-error.js';
import { NO_OPEN_CHECKOUT } from './open-checkout.js';
import { planByCode, planOfLookupKey, TRIAL_PLAN, type PlanDefinition } from './plan-catalogue.js';

/** The organisation's row, locked until the transaction ends: limit checks and webhook effects on one tenant take turns. */
export async function lockOrganisation(em: EntityManager, organisationId: string): Promise<Organisation> {
  const org = await em.getRepository(Organisation).createQueryBuilder('o').setLock('pessimistic_write').where('o.id = :id', { id: organisationId }).getOne();
  if (!org) throw notFound('No such organisation');
  return org;
}

/** The plan whose limits apply now: the subscribed one while it runs, the trial's otherwise. */
export function currentPlan(org: Organisation): PlanDefinition {
  if (org.subscriptionStatus === 'trialing' && !org.stripeSubscriptionId) return TRIAL_PLAN;
  return planOfLookupKey(org.priceLookupKey)?.plan ?? planByCode(org.plan);
}

export async function usageOf(em: EntityManager, organisationId: string): Promise<PlanLimits> {
  const [units, clientGroups, limitedMembers, limitedInvitations] = await Promise.all([
    em.getRepository(GeneratingUnit).countBy({ organisationId }),
    em.getRepository(ClientGroup).countBy({ organisationId }),
    em
      .getRepository(Membership)
      .createQueryBuilder('m')
      .where('m.organisationId = :organisationId AND m.clientGroupIds IS NOT NULL', { organisationId })
      .getCount(),
    em
      .getRepository(Invitation)
      .createQueryBuilder('i')
      .where('i.organisationId = :organisationId AND i.clientGroupIds IS NOT NULL AND i.acceptedAt IS NULL AND i.expiresAt > :now', {
        organisationId,
        now: new Date(),
      })
      .getCount(),
  ]);
  return { units, clientGroups, seats: limitedMembers + limitedInvitations };
}

const STATUSES: readonly SubscriptionStatus[] = ['trialing', 'active', 'past_due', 'canceled', 'unpaid'];

/** Stripe's word for the state, kept as Stripe says it; the states we do not sell into count as unpaid. */
function statusOf(sub: Stripe.Subscription): SubscriptionStatus {
  if ((STATUSES as readonly string[]).includes(sub.status)) return sub.status as SubscriptionStatus;
  return sub.status === 'incomplete_expired' ? 'canceled' : 'unpaid';
}

/** Writes a subscription read from Stripe at `readAt` onto the (locked) organisation, unless a newer read is there already. */
export async function applySubscription(em: EntityManager, org: Organisation, sub: Stripe.Subscription, readAt: Date): Promise<boolean> {
  if (org.billingStateAt && org.billingStateAt.getTime() > readAt.getTime()) return false;
  // A subscription that is not the organisation's current one (an older, replaced one) changes nothing.
  if (org.stripeSubscriptionId && org.stripeSubscriptionId !== sub.id && sub.status === 'canceled') return false;
  const item = sub.items.data[0];
  const priced = planOfLookupKey(item?.price.lookup_key);
  const status = statusOf(sub);
  const periodEnd = (item as { current_period_end?: number } | undefined)?.current_period_end ?? (sub as { current_period_end?: number }).current_period_end;
  const changes: Partial<Organisation> = {
    stripeSubscriptionId: sub.id,
    stripeCustomerId: typeof sub.customer === 'string' ? sub.customer : sub.customer.id,
    subscriptionStatus: status,
    plan: priced?.plan.code ?? org.plan,
    priceLookupKey: item?.price.lookup_key ?? org.priceLookupKey,
    currentPeriodEnd: periodEnd ? new Date(periodEnd * 1000) : null,
    cancelAtPeriodEnd: sub.cancel_at_period_end,
    pastDueSince: status === 'past_due' ? (org.pastDueSince ?? readAt) : null,
    billingStateAt: readAt,
    // A live subscription closes the Checkout page that led to it: its plan is the one that holds now.
    ...(['active', 'past_due', 'trialing'].includes(status) ? NO_OPEN_CHECKOUT : {}),
  };
  await em.getRepository(Organisation).update({ id: org.id }, changes);
  Object.assign(org, changes);
  return true;
}

export type { LimitName };
