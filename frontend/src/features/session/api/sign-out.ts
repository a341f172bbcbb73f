import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/api/session', { method: 'DELETE' }),
    onSuccess: () => {
      queryClient.clear();
      queryClient.setQueryData(['session'], { user: null, activeOrganisationId: null, memberships: [] });
    },
  });
}
