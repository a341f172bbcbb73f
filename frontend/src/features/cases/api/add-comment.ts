import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseComment, CaseCommentCreate } from '@shared/schemas/cases';
import { caseCommentsQueryOptions } from './get-comments';

export function useAddComment(organisationId: string, caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CaseCommentCreate) => api<CaseComment>(`/api/cases/${caseId}/comments`, { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseCommentsQueryOptions(organisationId, caseId).queryKey }),
  });
}
