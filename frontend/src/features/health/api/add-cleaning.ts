import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnitEventInput } from '@shared/schemas/unit-event';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

/** Records a cleaning on the unit's timeline; the server queues a recompute, which the unit's jobs show. */
export function useAddCleaning(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UnitEventInput) => api<{ id: string }>(`/api/units/${unitId}/events`, { method: 'POST', body }),
    // the unit (its jobs now include the recompute), its events and its health view
    onSuccess: () => queryClient.invalidateQueries({ queryKey: unitKey(organisationId, unitId) }),
  });
}
