import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import type { JobView } from '@shared/schemas/jobs';
import type { UnitDetail } from '@shared/schemas/plant';

export type { UnitDetail };
export type UnitJob = JobView;

export const jobIsActive = (j: UnitJob) => j.status === 'queued' || j.status === 'running';

/** One unit; polled every 1.5 s while background work (recompute, import) is queued or running. */
export const unitQueryOptions = (organisationId: string, unitId: string) =>
  queryOptions({
    queryKey: unitKey(organisationId, unitId),
    queryFn: () => api<UnitDetail>(`/api/units/${unitId}`),
    refetchInterval: (query) => (query.state.data?.jobs.some(jobIsActive) ? 1500 : false),
  });

export const useUnit = (organisationId: string, unitId: string) => useQuery(unitQueryOptions(organisationId, unitId));
