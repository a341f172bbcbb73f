import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseApprove, CaseReturn, CaseView } from '@shared/schemas/cases';
import { caseKey, casesKey } from './case-keys';

export type CaseStep = 'submit' | 'approve' | 'return' | 'archive' | 'copy';

/**
 * One step of the approval path. `copy` answers the new draft (a different case); the others answer this case
 * in its new status.
 */
export function useChangeCaseStatus(organisationId: string, caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ step, body }: { step: CaseStep; body?: CaseReturn | CaseApprove | { reason: string } }) =>
      api<CaseView>(`/api/cases/${caseId}/${step}`, { method: 'POST', body: body ?? {} }),
    onSuccess: async (answered) => {
      queryClient.setQueryData(caseKey(organisationId, answered.id), answered);
      await queryClient.invalidateQueries({ queryKey: casesKey(organisationId) });
    },
  });
}
