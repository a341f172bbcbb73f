import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantInput } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { plantsQueryOptions, type PlantView } from './get-plants';

export function useCreatePlant(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PlantInput) => api<PlantView>('/api/plants', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: plantsQueryOptions(organisationId).queryKey }),
  });
}
