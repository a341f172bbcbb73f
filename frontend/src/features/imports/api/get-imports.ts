import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import { importIsRunning, type ImportView } from './get-import';

/** A unit's import history, newest first; polled while one of them is still running. */
export const unitImportsQueryOptions = (organisationId: string, unitId: string) =>
  queryOptions({
    queryKey: [...unitKey(organisationId, unitId), 'imports'],
    queryFn: () => api<{ imports: ImportView[] }>(`/api/units/${unitId}/imports`).then((r) => r.imports),
    refetchInterval: (query) => (query.state.data?.some((i) => importIsRunning(i.status)) ? 2000 : false),
  });

export const useUnitImports = (organisationId: string, unitId: string) => useQuery(unitImportsQueryOptions(organisationId, unitId));
