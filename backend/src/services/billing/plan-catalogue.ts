/**
 * Our plans (our own names and fictional prices, in US cents), by the number of units, and a consultancy plan
 * with many client groups and client-limited seats (members who see only some clients' plants). Stripe holds the products and prices: they are made at start
 * (idempotently, by lookup key) and their ids and amounts are read back from Stripe, never written here.
 */
import type { LimitName, PlanLimits } from '@shared/schemas/billing.js';

export interface PlanDefinition {
  code: string;
  name: string;
  limits: PlanLimits;
  cents: { month: number; year: number };
}

export const PLANS: readonly PlanDefinition[] = [
  { code: 'plant', name: 'Plant', limits: { units: 2, clientGroups: 2, seats: 0 }, cents: { month: 19_000, year: 190_000 } },
  { code: 'station', name: 'Station', limits: { units: 10, clientGroups: 5, seats: 5 }, cents: { month: 69_000, year: 690_000 } },
  { code: 'fleet', name: 'Fleet', limits: { units: 40, clientGroups: 10, seats: 20 }, cents: { month: 190_000, year: 1_900_000 } },
  { code: 'consultancy', name: 'Consultancy', limits: { units: 40, clientGroups: 50, seats: 100 }, cents: { month: 240_000, year: 2_400_000 } },
];

/** The trial lets a new organisation try everything at the consultancy plan's size. */
export const TRIAL_PLAN: PlanDefinition = { code: 'trial', name: 'Trial', limits: PLANS[3]!.limits, cents: { month: 0, year: 0 } };

export const INTERVALS = ['month', 'year'] as const;
export type Interval = (typeof INTERVALS)[number];
export const CURRENCY = 'usd';

export const lookupKeyOf = (plan: PlanDefinition, interval: Interval) => `cleancase_${plan.code}_${interval}`;
export const productIdOf = (plan: PlanDefinition) => `cleancase_${plan.code}`;

export function planByCode(code: string): PlanDefinition {
  return PLANS.find((p) => p.code === code) ?? TRIAL_PLAN;
}

export function planOfLookupKey(key: string | null | undefined): { plan: PlanDefinition; interval: Interval } | null {
  for (const plan of PLANS) for (const interval of INTERVALS) if (lookupKeyOf(plan, interval) === key) return { plan, interval };
  return null;
}

export const LIMIT_WORDS: Record<LimitName, { one: string; many: string }> = {
  units: { one: 'unit', many: 'units' },
  clientGroups: { one: 'client group', many: 'client groups' },
  seats: { one: 'client-limited member', many: 'client-limited members' },
};

/** The cheapest plan that allows more than `count` of a limit, or null when none does. */
export function planLifting(limit: LimitName, count: number): PlanDefinition | null {
  return [...PLANS].sort((a, b) => a.cents.month - b.cents.month).find((p) => p.limits[limit] > count) ?? null;
}
