import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateOrganisationRequest } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

/** Another organisation on a trial, with the caller as administrator; the server switches to it. */
export function useCreateOrganisation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateOrganisationRequest) => api<SessionResponse>('/api/organisations', { method: 'POST', body }),
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
