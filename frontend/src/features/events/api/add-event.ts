import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnitEventInput } from '@shared/schemas/unit-event';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import type { UnitEventView } from './get-events';

export function useAddEvent(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UnitEventInput) => api<UnitEventView>(`/api/units/${unitId}/events`, { method: 'POST', body }),
    // the timeline, and the unit (a cleaning or plugging queues a recompute)
    onSuccess: () => queryClient.invalidateQueries({ queryKey: unitKey(organisationId, unitId) }),
  });
}
