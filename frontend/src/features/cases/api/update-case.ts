import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CasePatch, CaseView } from '@shared/schemas/cases';
import { caseKey, casesKey } from './case-keys';

/** Saves the title or the inputs; the server answers the whole case with its own recomputed results. */
export function useUpdateCase(organisationId: string, caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CasePatch) => api<CaseView>(`/api/cases/${caseId}`, { method: 'PATCH', body }),
    onSuccess: async (saved) => {
      queryClient.setQueryData(caseKey(organisationId, caseId), saved);
      await queryClient.invalidateQueries({ queryKey: casesKey(organisationId) });
    },
  });
}
