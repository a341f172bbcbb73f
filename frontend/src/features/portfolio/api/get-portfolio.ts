import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { PortfolioResponse } from '@shared/schemas/portfolio';

/** Every unit the member may see with its figures now; keyed by organisation so tenants never share an entry. */
export const portfolioQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'portfolio'] as const,
    queryFn: () => api<PortfolioResponse>('/api/portfolio'),
  });

export const usePortfolio = (organisationId: string) => useQuery(portfolioQueryOptions(organisationId));
