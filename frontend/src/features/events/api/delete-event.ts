import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';

export function useDeleteEvent(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<void>(`/api/events/${id}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: unitKey(organisationId, unitId) }),
  });
}
