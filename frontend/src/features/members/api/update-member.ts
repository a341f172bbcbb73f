import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MemberUpdate } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { membersQueryOptions } from './get-members';

export function useUpdateMember(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ membershipId, ...body }: MemberUpdate & { membershipId: string }) => api<void>(`/api/members/${membershipId}`, { method: 'PATCH', body }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersQueryOptions(organisationId).queryKey }),
  });
}
