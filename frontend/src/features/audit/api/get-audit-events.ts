import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import type { auditQuery, AuditEventsResponse } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

/** The audit query's filters (its request schema without the page size). */
export type AuditFilters = Pick<z.input<typeof auditQuery>, 'action' | 'userId' | 'entityType' | 'from' | 'to'>;

const FILTER_KEYS = ['action', 'userId', 'entityType', 'from', 'to'] as const;

/** The filters live in the address, so a filtered view can be bookmarked, shared or printed. */
export function auditFiltersFrom(params: URLSearchParams): AuditFilters {
  return Object.fromEntries(FILTER_KEYS.flatMap((k) => (params.get(k) ? [[k, params.get(k)!]] : [])));
}

const toSearch = (f: AuditFilters) =>
  new URLSearchParams(Object.entries(f).filter((e): e is [string, string] => typeof e[1] === 'string' && e[1] !== '')).toString();

export const auditEventsQueryOptions = (organisationId: string, filters: AuditFilters) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'audit-events', filters],
    queryFn: () => {
      const search = toSearch(filters);
      return api<AuditEventsResponse>(`/api/audit-events${search ? `?${search}` : ''}`).then((r) => r.events);
    },
    placeholderData: keepPreviousData,
  });

export const useAuditEvents = (organisationId: string, filters: AuditFilters) => useQuery(auditEventsQueryOptions(organisationId, filters));
