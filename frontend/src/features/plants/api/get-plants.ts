import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { plantsKey } from '@frontend/lib/query-keys';

export interface UnitListItem {
  id: string;
  name: string;
  ratingMw: number | null;
  setupComplete: boolean;
}

export interface PlantView {
  id: string;
  name: string;
  timeZone: string;
  clientGroupId: string | null;
  units: UnitListItem[];
}

/** Keyed by organisation, so one tenant's plants can never be read from the cache under another. */
export const plantsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: plantsKey(organisationId),
    queryFn: () => api<{ plants: PlantView[] }>('/api/plants').then((r) => r.plants),
  });

export const usePlants = (organisationId: string) => useQuery(plantsQueryOptions(organisationId));
