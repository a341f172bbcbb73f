import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CleaningMethod } from '@shared/schemas/cleaning-method';
import { api } from '@frontend/lib/api-client';
import { cleaningMethodsQueryOptions, type CleaningMethodView } from './get-cleaning-methods';

export function useUpdateCleaningMethod(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ recordId, method }: { recordId: string; method: CleaningMethod }) =>
      api<CleaningMethodView>(`/api/cleaning-methods/${recordId}`, { method: 'PUT', body: method }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: cleaningMethodsQueryOptions(organisationId).queryKey }),
  });
}
