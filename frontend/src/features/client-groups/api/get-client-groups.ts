import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ClientGroupsResponse } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

/** Keyed by organisation, so one tenant's groups can never be read from the cache under another. */
export const clientGroupsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'client-groups'],
    queryFn: () => api<ClientGroupsResponse>('/api/client-groups').then((r) => r.clientGroups),
  });

export const useClientGroups = (organisationId: string) => useQuery(clientGroupsQueryOptions(organisationId));
