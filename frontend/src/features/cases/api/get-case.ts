import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseView } from '@shared/schemas/cases';
import { caseKey } from './case-keys';

export type { CaseView };

export const caseQueryOptions = (organisationId: string, caseId: string) =>
  queryOptions({
    queryKey: caseKey(organisationId, caseId),
    queryFn: () => api<CaseView>(`/api/cases/${caseId}`),
  });

export const useCase = (organisationId: string, caseId: string) => useQuery(caseQueryOptions(organisationId, caseId));
