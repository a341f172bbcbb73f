/** GET /api/billing/notice: what every member is shown about the subscription (the banner), without amounts or invoices. */
import type { EntityManager } from 'typeorm';
import type { BillingNotice } from '@shared/schemas/billing.js';
import { readOnlyReason, trialDaysLeft, trialEndingSoon } from '@shared/billing-access.js';
import type { Organisation } from '../../entities/organisation.entity.js';
import { overLimitOf } from './open-checkout.js';
import { currentPlan, usageOf } from './organisation-billing.js';

export async function getBillingNotice(em: EntityManager, org: Organisation, now = new Date()): Promise<BillingNotice> {
  const onTrial = !org.stripeSubscriptionId;
  const over = overLimitOf(currentPlan(org), await usageOf(em, org.id));
  return {
    status: org.subscriptionStatus,
    readOnly: readOnlyReason(org, now),
    trialEndsAt: onTrial && org.trialEndsAt ? org.trialEndsAt.toISOString() : null,
    trialDaysLeft: onTrial ? trialDaysLeft(org, now) : null,
    trialEndingSoon: onTrial && trialEndingSoon(org, now),
    overLimit: over.length ? over.map((o) => o.message).join(' ') : null,
  };
}
