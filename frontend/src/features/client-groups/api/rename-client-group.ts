import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ClientGroupInput, ClientGroupView } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { clientGroupsQueryOptions } from './get-client-groups';

export function useRenameClientGroup(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, name }: ClientGroupInput & { id: string }) => api<ClientGroupView>(`/api/client-groups/${id}`, { method: 'PATCH', body: { name } }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: clientGroupsQueryOptions(organisationId).queryKey }),
  });
}
