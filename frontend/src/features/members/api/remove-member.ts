import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { membersQueryOptions } from './get-members';

export function useRemoveMember(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: string) => api<void>(`/api/members/${membershipId}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(organisationId).queryKey }),
  });
}
