import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { plantsKey } from '@frontend/lib/query-keys';
import type { PlantsResponse, PlantView, UnitSummary } from '@shared/schemas/plant';

export type { PlantView };
export type UnitListItem = UnitSummary;

/** Keyed by organisation, so one tenant's plants can never be read from the cache under another. */
export const plantsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: plantsKey(organisationId),
    queryFn: () => api<PlantsResponse>('/api/plants').then((r) => r.plants),
  });

export const usePlants = (organisationId: string) => useQuery(plantsQueryOptions(organisationId));
