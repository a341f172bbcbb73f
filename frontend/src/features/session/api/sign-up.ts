import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpRequest } from '@shared/schemas/accounts';
import type { MessageResponse } from '@shared/schemas/errors';
import type { SessionResponse } from '@shared/schemas/session';
import { api, ApiError } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

/**
 * New account and organisation on a trial, then sign-in with the same e-mail and password. The sign-up answer is
 * the same whether or not the address had an account; when sign-in then fails, its message says what happened.
 */
export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (body: SignUpRequest) => {
      const answer = await api<MessageResponse>('/api/sign-up', { method: 'POST', body });
      try {
        return await api<SessionResponse>('/api/session', { method: 'POST', body: { email: body.email, password: body.password } });
      } catch (err) {
        if (err instanceof ApiError && err.status === 401) throw new ApiError(401, answer.message);
        throw err;
      }
    },
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
