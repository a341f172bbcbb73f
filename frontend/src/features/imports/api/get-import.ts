import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RejectionReason } from '@shared/domain/validity/rejection-reasons';
import type { ImportMappingInput } from '@shared/schemas/import-mapping';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export type ImportStatus = 'mapping' | 'checking' | 'rejected' | 'importing' | 'complete' | 'failed' | 'undone';

export interface ImportCounts {
  rowsRead?: number;
  stored?: number;
  skippedIdentical?: number;
  conflicting?: number;
  conflicts?: { timestampUtc: string }[];
  rowsOk?: number;
  rowsByReason?: Partial<Record<RejectionReason, number>>;
  flowAssumedRows?: number;
}

export interface ImportRowError {
  row: number;
  column: string;
  value: string;
  message: string;
}

export interface ImportView {
  id: string;
  unitId: string;
  fileName: string;
  fileBytes: number;
  fileKind: string | null;
  status: ImportStatus;
  progress: number;
  message: string | null;
  counts: ImportCounts | null;
  errorCount: number;
  /** The first 200; all of them are in the CSV report. */
  errors: ImportRowError[];
  notes: { assumptions: string[]; warnings: string[] } | null;
  firstTimestamp: string | null;
  lastTimestamp: string | null;
  createdAt: string;
  finishedAt: string | null;
  mapping: ImportMappingInput | null;
}

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
