import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnitEventInput } from '@shared/schemas/unit-event';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import type { UnitEventView } from './get-events';

export function useUpdateEvent(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: UnitEventInput & { id: string }) => api<UnitEventView>(`/api/events/${id}`, { method: 'PUT', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: unitKey(organisationId, unitId) }),
  });
}
