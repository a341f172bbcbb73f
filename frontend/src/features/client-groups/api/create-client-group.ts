import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClientGroupInput, ClientGroupView } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { clientGroupsQueryOptions } from './get-client-groups';

export function useCreateClientGroup(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ClientGroupInput) => api<ClientGroupView>('/api/client-groups', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientGroupsQueryOptions(organisationId).queryKey }),
  });
}
