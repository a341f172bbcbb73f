import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseListQuery, CaseListResponse, CaseSummary } from '@shared/schemas/cases';
import { caseListKey } from './case-keys';

export type { CaseSummary };

function listPath(filters: CaseListQuery): string {
  const q = new URLSearchParams();
  if (filters.status) q.set('status', filters.status);
  if (filters.unitId) q.set('unitId', filters.unitId);
  const query = q.toString();
  return `/api/cases${query ? `?${query}` : ''}`;
}

/** The organisation's cases the person may see, filtered by status and unit. */
export const casesQueryOptions = (organisationId: string, filters: CaseListQuery = {}) =>
  queryOptions({
    queryKey: caseListKey(organisationId, filters),
    queryFn: () => api<CaseListResponse>(listPath(filters)).then((r) => r.cases),
  });

export const useCases = (organisationId: string, filters: CaseListQuery = {}) => useQuery(casesQueryOptions(organisationId, filters));
