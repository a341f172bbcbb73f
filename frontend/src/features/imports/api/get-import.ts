import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { ImportCounts, ImportStatus, ImportView, RowErrorView } from '@shared/schemas/imports';

export type { ImportCounts, ImportStatus, ImportView };
export type ImportRowError = RowErrorView;

export const importIsRunning = (status: ImportStatus) => status === 'checking' || status === 'importing';

/** One import; polled each second while it is being checked or stored. */
export const importQueryOptions = (organisationId: string, importId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'imports', importId],
    queryFn: () => api<ImportView>(`/api/imports/${importId}`),
    refetchInterval: (query) => (query.state.data && importIsRunning(query.state.data.status) ? 1000 : false),
  });

export const useImport = (organisationId: string, importId: string | null) =>
  useQuery({ ...importQueryOptions(organisationId, importId ?? ''), enabled: !!importId });
