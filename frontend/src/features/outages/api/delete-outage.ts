import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { outageKey, outagesKey } from './outage-keys';

/** Deletes an outage (administrators; the audit log keeps its record). */
export function useDeleteOutage(organisationId: string, outageId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>(`/api/outages/${outageId}`, { method: 'DELETE' }),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: outageKey(organisationId, outageId) });
      await queryClient.invalidateQueries({ queryKey: outagesKey(organisationId) });
    },
  });
}
