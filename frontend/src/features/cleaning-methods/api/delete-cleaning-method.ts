import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { cleaningMethodsQueryOptions } from './get-cleaning-methods';

export function useDeleteCleaningMethod(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (recordId: string) => api<void>(`/api/cleaning-methods/${recordId}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: cleaningMethodsQueryOptions(organisationId).queryKey }),
  });
}
