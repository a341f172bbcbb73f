import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { OutageView } from '@shared/schemas/outages';
import { outageKey } from './outage-keys';

export type { OutageView };

export const outageQueryOptions = (organisationId: string, outageId: string) =>
  queryOptions({
    queryKey: outageKey(organisationId, outageId),
    queryFn: () => api<OutageView>(`/api/outages/${outageId}`),
  });

export const useOutage = (organisationId: string, outageId: string) => useQuery(outageQueryOptions(organisationId, outageId));
