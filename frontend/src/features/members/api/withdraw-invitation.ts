import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { invitationsQueryOptions } from './get-invitations';

export function useWithdrawInvitation(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => api<void>(`/api/invitations/${invitationId}`, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions(organisationId).queryKey }),
  });
}
