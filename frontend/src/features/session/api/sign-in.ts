import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionResponse, SignInRequest } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInRequest) => api<SessionResponse>('/api/session', { method: 'POST', body }),
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
