/** When an organisation becomes read-only, and the trial's last days: the one rule the route chain and the banner share. */
import { describe, expect, it } from 'vitest';
import { PAST_DUE_GRACE_DAYS, readOnlyReason, trialDaysLeft, trialEndingSoon } from '../../../shared/billing-access.js';

const NOW = new Date('2026-06-15T12:00:00Z');
const DAY = 86_400_000;
const at = (days: number) => new Date(NOW.getTime() + days * DAY);

describe('read-only', () => {
  it('a running trial writes; the moment it ends it is read-only, saying the day and that nothing is deleted', () => {
    expect(readOnlyReason({ subscriptionStatus: 'trialing', trialEndsAt: at(0.01), pastDueSince: null }, NOW)).toBeNull();
    const reason = readOnlyReason({ subscriptionStatus: 'trialing', trialEndsAt: NOW, pastDueSince: null }, NOW);
    expect(reason).toMatch(/^The trial ended on 15 Jun 2026: the organisation is read-only/);
    expect(reason).toMatch(/Nothing has been deleted/);
  });

  it('a trial without an end date (organisations made before trials had one) is not read-only', () => {
    expect(readOnlyReason({ subscriptionStatus: 'trialing', trialEndsAt: null, pastDueSince: null }, NOW)).toBeNull();
  });

  it(`past due keeps writing for ${PAST_DUE_GRACE_DAYS} days, then is read-only`, () => {
    const pastDue = (days: number) => ({ subscriptionStatus: 'past_due', trialEndsAt: null, pastDueSince: at(-days) });
    expect(readOnlyReason(pastDue(PAST_DUE_GRACE_DAYS - 0.01), NOW)).toBeNull();
    expect(readOnlyReason(pastDue(PAST_DUE_GRACE_DAYS), NOW)).toMatch(/payment due on 8 Jun 2026 has not been made/);
  });

  it('canceled and unpaid are read-only; active is not, whatever its trial date says', () => {
    for (const status of ['canceled', 'unpaid'])
      expect(readOnlyReason({ subscriptionStatus: status, trialEndsAt: null, pastDueSince: null }, NOW)).toMatch(/ended/);
    expect(readOnlyReason({ subscriptionStatus: 'active', trialEndsAt: at(-30), pastDueSince: null }, NOW)).toBeNull();
  });

  it('reads ISO strings as the browser has them', () => {
    expect(readOnlyReason({ subscriptionStatus: 'trialing', trialEndsAt: at(-1).toISOString(), pastDueSince: null }, NOW)).toMatch(/14 Jun 2026/);
  });
});

describe("the trial's last days", () => {
  it('counts whole days left, rounding up, and calls the last three "ending soon"', () => {
    const trial = (days: number) => ({ subscriptionStatus: 'trialing', trialEndsAt: at(days), pastDueSince: null });
    expect(trialDaysLeft(trial(10), NOW)).toBe(10);
    expect(trialDaysLeft(trial(3.2), NOW)).toBe(4);
    expect(trialEndingSoon(trial(3.2), NOW)).toBe(false);
    expect(trialEndingSoon(trial(3), NOW)).toBe(true);
    expect(trialDaysLeft(trial(0.1), NOW)).toBe(1);
    expect(trialDaysLeft(trial(-1), NOW)).toBeNull();
    expect(trialDaysLeft({ subscriptionStatus: 'active', trialEndsAt: at(5), pastDueSince: null }, NOW)).toBeNull();
  });
});
