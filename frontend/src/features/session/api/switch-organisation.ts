import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { replaceSession } from './get-session';

export function useSwitchOrganisation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (organisationId: string) => api<SessionResponse>('/api/session/organisation', { method: 'POST', body: { organisationId } }),
    onSuccess: (session) => replaceSession(queryClient, session),
  });
}
