import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationView, InviteRequest } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { invitationsQueryOptions } from './get-invitations';

export function useSendInvitation(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteRequest) => api<InvitationView>('/api/invitations', { method: 'POST', body }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryOptions(organisationId).queryKey }),
  });
}
