import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { CaseCreate, CaseView } from '@shared/schemas/cases';
import { caseKey, casesKey } from './case-keys';

/** A new draft on a unit, its inputs prefilled by the server from the unit's data. */
export function useCreateCase(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CaseCreate) => api<CaseView>(`/api/units/${unitId}/cases`, { method: 'POST', body }),
    onSuccess: async (created) => {
      queryClient.setQueryData(caseKey(organisationId, created.id), created);
      await queryClient.invalidateQueries({ queryKey: casesKey(organisationId) });
    },
  });
}
