import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApiTokenCreate, CreatedApiToken } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { apiTokensQueryOptions } from './get-api-tokens';

/** The answer carries the secret, once; it is never cached. */
export function useCreateApiToken(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ApiTokenCreate) => api<CreatedApiToken>('/api/api-tokens', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: apiTokensQueryOptions(organisationId).queryKey }),
  });
}
