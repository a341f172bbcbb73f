import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CleaningMethod } from '@shared/schemas/cleaning-method';
import { api } from '@frontend/lib/api-client';
import { cleaningMethodsQueryOptions, type CleaningMethodView } from './get-cleaning-methods';

export function useCreateCleaningMethod(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CleaningMethod) => api<CleaningMethodView>('/api/cleaning-methods', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cleaningMethodsQueryOptions(organisationId).queryKey }),
  });
}
