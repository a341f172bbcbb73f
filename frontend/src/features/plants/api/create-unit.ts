import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnitInput } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { plantsQueryOptions, type UnitListItem } from './get-plants';

export function useCreateUnit(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ plantId, name }: UnitInput & { plantId: string }) => api<UnitListItem>(`/api/plants/${plantId}/units`, { method: 'POST', body: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantsQueryOptions(organisationId).queryKey }),
  });
}
