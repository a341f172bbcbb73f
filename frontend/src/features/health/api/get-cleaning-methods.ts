import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export interface CleaningMethodChoice {
  id: string;
  name: string;
}

/** The organisation's cleaning-method library, for naming the method of a recorded cleaning. */
export const cleaningMethodsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'cleaning-methods'],
    queryFn: () => api<{ methods: CleaningMethodChoice[] }>('/api/cleaning-methods').then((r) => r.methods),
    staleTime: 5 * 60_000,
  });

export const useCleaningMethods = (organisationId: string, enabled: boolean) => useQuery({ ...cleaningMethodsQueryOptions(organisationId), enabled });
