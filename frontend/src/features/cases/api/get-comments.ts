import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseComment, CaseCommentsResponse } from '@shared/schemas/cases';
import { caseKey } from './case-keys';

export type { CaseComment };

export const caseCommentsQueryOptions = (organisationId: string, caseId: string) =>
  queryOptions({
    queryKey: [...caseKey(organisationId, caseId), 'comments'],
    queryFn: () => api<CaseCommentsResponse>(`/api/cases/${caseId}/comments`).then((r) => r.comments),
  });

export const useCaseComments = (organisationId: string, caseId: string) => useQuery(caseCommentsQueryOptions(organisationId, caseId));
