import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ApiTokensResponse } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export const apiTokensQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'api-tokens'],
    queryFn: () => api<ApiTokensResponse>('/api/api-tokens').then((r) => r.apiTokens),
  });

export const useApiTokens = (organisationId: string) => useQuery(apiTokensQueryOptions(organisationId));
