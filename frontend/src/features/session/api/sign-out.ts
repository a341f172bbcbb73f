import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { SIGNED_OUT_SESSION, sessionQueryOptions } from './get-session';

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>('/api/session', { method: 'DELETE' }),
    onSuccess: () => {
      const devMailbox = queryClient.getQueryData(sessionQueryOptions().queryKey)?.devMailbox ?? false;
      queryClient.clear();
      queryClient.setQueryData(sessionQueryOptions().queryKey, SIGNED_OUT_SESSION(devMailbox));
    },
  });
}
