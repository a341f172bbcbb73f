import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { clientGroupsQueryOptions } from './get-client-groups';

export function useDeleteClientGroup(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<void>(`/api/client-groups/${id}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: clientGroupsQueryOptions(organisationId).queryKey }),
  });
}
