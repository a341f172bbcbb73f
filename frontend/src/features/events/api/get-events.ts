import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import type { UnitEventsResponse, UnitEventView } from '@shared/schemas/unit-event';

export type { UnitEventView };

export const eventsQueryOptions = (organisationId: string, unitId: string) =>
  queryOptions({
    queryKey: [...unitKey(organisationId, unitId), 'events'],
    queryFn: () => api<UnitEventsResponse>(`/api/units/${unitId}/events`).then((r) => r.events),
  });

export const useEvents = (organisationId: string, unitId: string) => useQuery(eventsQueryOptions(organisationId, unitId));
