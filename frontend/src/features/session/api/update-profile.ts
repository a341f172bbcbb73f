import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ProfileUpdate } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';
import { sessionQueryOptions } from './get-session';

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ProfileUpdate) => api<SessionResponse>('/api/profile', { method: 'PATCH', body }),
    onSuccess: (session) => queryClient.setQueryData(sessionQueryOptions().queryKey, session),
  });
}
