import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PasswordChange } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { sessionQueryOptions } from './get-session';

/** Other sessions of the account end; this one continues under a new id. */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: PasswordChange) => api<SessionResponse>('/api/profile/password', { method: 'POST', body }),
    onSuccess: (session) => queryClient.setQueryData(sessionQueryOptions().queryKey, session),
  });
}
