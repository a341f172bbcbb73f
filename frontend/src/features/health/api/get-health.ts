import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BreakdownCause } from '@shared/schemas/health';
import type { UNIT_EVENT_KINDS } from '@shared/schemas/unit-event';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

/** The period the health view asks for; `from` and `to` are plant-local days, absent = the server's default. */
export interface HealthPeriodQuery {
  from?: string;
  to?: string;
  breakdownBy: 'week' | 'month';
}

export interface NextCleaning {
  status: 'planned' | 'none-needed' | 'not-available';
  reason?: string;
  planFrom?: string;
  horizonDays?: number;
  next?: {
    date: string;
    endDate: string;
    methodId: string;
    methodName: string;
    cleanlinessBefore: number;
    cleanlinessAfter: number;
    cleaningCost: number;
    downtimeCost: number;
    typicalValues: boolean;
  };
  cleaningsInHorizon?: number;
  savingsVersusNoCleaning?: number;
  methodsBasis: string;
}

export interface HealthHeadline {
  asOf: string | null;
  cleanliness: number | null;
  trendCleanliness: number | null;
  referenceCleanliness: number | null;
  designCleanliness: number | null;
  excessBackpressureKpa: number | null;
  foulingCostPerDay: number | null;
  unexplainedCostPerDay: number | null;
  foulingCostSinceCleaning: number | null;
  lastCleaning: { date: string; notes: string | null; cleanlinessAfter: number | null } | null;
  lastSampleUtc: string | null;
  nextCleaning: NextCleaning | null;
  averagingNote: string;
  costBasis: string | null;
}

export interface HealthDay {
  day: string;
  cleanliness: number | null;
  trendCleanliness: number | null;
  backpressureKpa: number | null;
  expectedBackpressureKpa: number | null;
  excessBackpressureKpa: number | null;
  ttdK: number | null;
  cwInletC: number | null;
  loadMw: number | null;
  foulingCost: number | null;
  unexplainedCost: number | null;
  cumulativeFoulingCost: number;
  airLeakSuspected: boolean;
}

export type BreakdownBar = { period: string; meanExcessBackpressureKpa: number | null; foulingCost: number; unexplainedCost: number } & Record<BreakdownCause, number | null>;

export type AirLeakEvidence = 'cleanliness-drop' | 'subcooling' | 'dissolved-oxygen' | 'air-removal';

export interface HealthEvent {
  id: string;
  kind: (typeof UNIT_EVENT_KINDS)[number];
  startDate: string;
  endDate: string | null;
  methodId: string | null;
  cost: number | null;
  cleanlinessBefore: number | null;
  cleanlinessAfter: number | null;
  pluggedTubesAfter: number | null;
  notes: string | null;
}

export interface TrendFit {
  startDay: string;
  status: string;
  model?: { model: string } & Record<string, number | string>;
  cleanlinessAfterCleaning?: number;
  rSquared?: number;
  residualStdCleanliness?: number;
  pointsUsed?: number;
  bandProbability?: number;
  reason?: string;
}

export interface UnitHealth {
  unit: { id: string; name: string; plant: { id: string; name: string; timeZone: string }; setupComplete: boolean };
  period: { from: string | null; to: string | null; breakdownBy: 'week' | 'month' };
  analysedAt: string | null;
  headline: HealthHeadline;
  design: { datasheetBackpressureKpa: number; modelBackpressureKpa: number | null; modelOffsetKpa: number | null } | null;
  trend: TrendFit | null;
  forecast: { day: string; cleanliness: number; low: number; high: number }[];
  series: HealthDay[];
  seriesDownsampled: boolean;
  breakdown: BreakdownBar[];
  events: HealthEvent[];
  airLeakPeriods: { from: string; to: string; maxDrop: number; evidence: AirLeakEvidence[]; note: string }[];
  /** what in the stored setup or data keeps figures out (implausible results, a design point the model cannot reach) */
  warnings: string[];
  dataQuality: {
    daysInPeriod: number;
    daysWithValidData: number;
    pointsUsed: number;
    pointsDropped: number;
    droppedByReason: Record<string, number>;
    dutyGap: { meanPct: number | null; daysOver5Pct: number; note: string };
    stuckSensors: { sensor: string; days: number; lastDay: string }[];
  };
}

export const healthSearch = (q: HealthPeriodQuery): string => {
  const p = new URLSearchParams();
  if (q.from) p.set('from', q.from);
  if (q.to) p.set('to', q.to);
  p.set('breakdownBy', q.breakdownBy);
  return p.toString();
};

/** Every health view of a unit, whatever its period: invalidated when a recompute ends. */
export const unitHealthKey = (organisationId: string, unitId: string) => [...unitKey(organisationId, unitId), 'health'] as const;

/** The health view of one unit over a period; the previous period stays on screen while the next loads. */
export const healthQueryOptions = (organisationId: string, unitId: string, q: HealthPeriodQuery) =>
  queryOptions({
    queryKey: [...unitHealthKey(organisationId, unitId), q],
    queryFn: () => api<UnitHealth>(`/api/units/${unitId}/health?${healthSearch(q)}`),
    placeholderData: keepPreviousData,
  });

export const useHealth = (organisationId: string, unitId: string, q: HealthPeriodQuery, enabled = true) =>
  useQuery({ ...healthQueryOptions(organisationId, unitId, q), enabled });
