import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { CleaningMethodsResponse, CleaningMethodView } from '@shared/schemas/cleaning-method';

/** One library entry as the API lists it: `recordId` addresses it, `id` is the key events refer to. */
export type { CleaningMethodView };

/** Keyed by organisation, so one tenant's library can never be read from the cache under another. */
export const cleaningMethodsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'cleaning-methods'],
    queryFn: () => api<CleaningMethodsResponse>('/api/cleaning-methods').then((r) => r.methods),
  });

export const useCleaningMethods = (organisationId: string, enabled = true) => useQuery({ ...cleaningMethodsQueryOptions(organisationId), enabled });
