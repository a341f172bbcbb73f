/** GET /api/billing/notice: what every member is shown about the subscription (the banner), without amounts or invoices. */
import type { BillingNotice } from '@shared/schemas/billing.js';
import { readOnlyReason, trialDaysLeft, trialEndingSoon } from '@shared/billing-access.js';
import type { Organisation } from '../../entities/organisation.entity.js';

export function billingNoticeOf(org: Organisation, now = new Date()): BillingNotice {
  const onTrial = !org.stripeSubscriptionId;
  return {
    status: org.subscriptionStatus,
    readOnly: readOnlyReason(org, now),
    trialEndsAt: onTrial && org.trialEndsAt ? org.trialEndsAt.toISOString() : null,
    trialDaysLeft: onTrial ? trialDaysLeft(org, now) : null,
    trialEndingSoon: onTrial && trialEndingSoon(org, now),
  };
}
