/**
 * When an organisation may change its records, from its subscription as last read from Stripe. Pure: the
 * server's route chain and the app's banner ask the same questions with the same clock value.
 * A lapsed organisation becomes read-only; nothing is deleted, and paying again restores everything.
 */
import { formatDayOfMoment } from './text/display-format.js';

/** Days a past-due subscription keeps working while Stripe retries the payment (our own choice). */
export const PAST_DUE_GRACE_DAYS = 7;
/** Every member sees the trial's end coming in its last days. */
export const TRIAL_BANNER_DAYS = 3;

const DAY_MS = 86_400_000;

export interface BillingStateFields {
  subscriptionStatus: string;
  trialEndsAt: Date | string | null;
  pastDueSince: Date | string | null;
}

const at = (d: Date | string | null): Date | null => (d === null ? null : typeof d === 'string' ? new Date(d) : d);
const day = (d: Date) => formatDayOfMoment(d, 'UTC');
const WHERE = 'an administrator can choose a plan under Settings → Billing';
const KEPT = 'Nothing has been deleted: reading and downloads keep working.';

/** Why writes are refused, or null while the organisation may write. */
export function readOnlyReason(org: BillingStateFields, now: Date): string | null {
  const trialEnd = at(org.trialEndsAt);
  switch (org.subscriptionStatus) {
    case 'trialing':
      if (trialEnd && trialEnd.getTime() <= now.getTime()) return `The trial ended on ${day(trialEnd)}: the organisation is read-only until ${WHERE}. ${KEPT}`;
      return null;
    case 'past_due': {
      const since = at(org.pastDueSince);
      if (since && since.getTime() + PAST_DUE_GRACE_DAYS * DAY_MS <= now.getTime()) {
        return `The payment due on ${day(since)} has not been made: the organisation is read-only until an administrator pays the open invoice or updates the card under Settings → Billing. ${KEPT}`;
      }
      return null;
    }
    case 'canceled':
    case 'unpaid':
      return `The subscription has ended: the organisation is read-only until ${WHERE}. ${KEPT}`;
    default:
      return null;
  }
}

/** Whole days left of a running trial (rounded up), or null when not on a running trial. */
export function trialDaysLeft(org: BillingStateFields, now: Date): number | null {
  const trialEnd = at(org.trialEndsAt);
  if (org.subscriptionStatus !== 'trialing' || !trialEnd || trialEnd.getTime() <= now.getTime()) return null;
  return Math.ceil((trialEnd.getTime() - now.getTime()) / DAY_MS);
}

/** The trial's last days: the time to show every member that it is ending. */
export function trialEndingSoon(org: BillingStateFields, now: Date): boolean {
  const left = trialDaysLeft(org, now);
  return left !== null && left <= TRIAL_BANNER_DAYS;
}
