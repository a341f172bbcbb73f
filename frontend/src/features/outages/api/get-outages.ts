import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { OutageListQuery, OutageListResponse, OutageSummary } from '@shared/schemas/outages';
import { outageListKey } from './outage-keys';

export type { OutageSummary };

function listPath(filters: OutageListQuery): string {
  const q = new URLSearchParams();
  if (filters.status) q.set('status', filters.status);
  if (filters.unitId) q.set('unitId', filters.unitId);
  const query = q.toString();
  return `/api/outages${query ? `?${query}` : ''}`;
}

/** The organisation's outages the person may see (viewers: approved ones), filtered by status and unit. */
export const outagesQueryOptions = (organisationId: string, filters: OutageListQuery = {}) =>
  queryOptions({
    queryKey: outageListKey(organisationId, filters),
    queryFn: () => api<OutageListResponse>(listPath(filters)).then((r) => r.outages),
  });

export const useOutages = (organisationId: string, filters: OutageListQuery = {}) => useQuery(outagesQueryOptions(organisationId, filters));
