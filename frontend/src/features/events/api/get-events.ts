import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UNIT_EVENT_KINDS } from '@shared/schemas/unit-event';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

export interface UnitEventView {
  id: string;
  unitId: string;
  kind: (typeof UNIT_EVENT_KINDS)[number];
  startDate: string;
  endDate: string | null;
  methodId: string | null;
  cost: number | null;
  cleanlinessBefore: number | null;
  cleanlinessAfter: number | null;
  pluggedTubesAfter: number | null;
  notes: string | null;
  createdAt: string;
}

export const eventsQueryOptions = (organisationId: string, unitId: string) =>
  queryOptions({
    queryKey: [...unitKey(organisationId, unitId), 'events'],
    queryFn: () => api<{ events: UnitEventView[] }>(`/api/units/${unitId}/events`).then((r) => r.events),
  });

export const useEvents = (organisationId: string, unitId: string) => useQuery(eventsQueryOptions(organisationId, unitId));
