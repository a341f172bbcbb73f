import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

export interface UnitJob {
  id: string;
  kind: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  progress: number;
  message: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface UnitDetail {
  id: string;
  name: string;
  plant: { id: string; name: string; timeZone: string; clientGroupId: string | null };
  condenser: CondenserSetup | null;
  turbine: TurbineSetup | null;
  economics: EconomicsSetup | null;
  setupVersion: number;
  setupComplete: boolean;
  samples: { count: number; first: string | null; last: string | null };
  jobs: UnitJob[];
}

export const jobIsActive = (j: UnitJob) => j.status === 'queued' || j.status === 'running';

/** One unit; polled every 1.5 s while background work (recompute, import) is queued or running. */
export const unitQueryOptions = (organisationId: string, unitId: string) =>
  queryOptions({
    queryKey: unitKey(organisationId, unitId),
    queryFn: () => api<UnitDetail>(`/api/units/${unitId}`),
    refetchInterval: (query) => (query.state.data?.jobs.some(jobIsActive) ? 1500 : false),
  });

export const useUnit = (organisationId: string, unitId: string) => useQuery(unitQueryOptions(organisationId, unitId));
