import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationRequest } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

/** Joins the invited organisation: as the signed-in person (empty body) or with a new account (name, password). */
export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationRequest) => api<SessionResponse>(`/api/invitation-links/${encodeURIComponent(token)}/accept`, { method: 'POST', body }),
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
