import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { plantsQueryOptions, type UnitListItem } from './get-plants';

export function useCreateUnit(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ plantId, name }: { plantId: string; name: string }) => api<UnitListItem>(`/api/plants/${plantId}/units`, { method: 'POST', body: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantsQueryOptions(organisationId).queryKey }),
  });
}
