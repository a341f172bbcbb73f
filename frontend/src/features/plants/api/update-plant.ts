import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PlantInput } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { PlantView } from './get-plants';

/** Rename a plant, or change its time zone or client group (the server takes the whole plant). */
export function useUpdatePlant(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: PlantInput & { id: string }) => api<PlantView>(`/api/plants/${id}`, { method: 'PUT', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: organisationKey(organisationId) }),
  });
}
