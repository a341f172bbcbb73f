import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpRequest } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

/** New account and organisation on a trial; the answer is the signed-in session. */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SignUpRequest) => api<SessionResponse>('/api/sign-up', { method: 'POST', body }),
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
