import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { apiTokensQueryOptions } from './get-api-tokens';

export function useRevokeApiToken(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<void>(`/api/api-tokens/${id}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: apiTokensQueryOptions(organisationId).queryKey }),
  });
}
