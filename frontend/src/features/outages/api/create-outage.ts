import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { OutageCreate, OutageView } from '@shared/schemas/outages';
import { outageKey, outagesKey } from './outage-keys';

/** A new draft outage: name, units, window and budget; items are added on its page. */
export function useCreateOutage(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: OutageCreate) => api<OutageView>('/api/outages', { method: 'POST', body }),
    onSuccess: async (created) => {
      queryClient.setQueryData(outageKey(organisationId, created.id), created);
      await queryClient.invalidateQueries({ queryKey: outagesKey(organisationId) });
    },
  });
}
