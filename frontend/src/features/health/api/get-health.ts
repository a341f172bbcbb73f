import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BreakdownBar, HealthDay, HealthHeadline, HealthQuery, HealthTrend, UnitHealthResponse } from '@shared/schemas/health';
import type { CleaningOutlookView } from '@shared/schemas/unit-analysis';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

/** The period the health view asks for; `from` and `to` are plant-local days, absent = the server's default (the health request schema). */
export type HealthPeriodQuery = HealthQuery;

export type { BreakdownBar, HealthDay, HealthHeadline };
export type UnitHealth = UnitHealthResponse;
export type NextCleaning = CleaningOutlookView;
export type HealthEvent = UnitHealthResponse['events'][number];
export type TrendFit = HealthTrend;
export type AirLeakEvidence = UnitHealthResponse['airLeakPeriods'][number]['evidence'][number];

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
