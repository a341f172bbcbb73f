import { useMutation } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (body: { email: string }) => api<{ message: string }>('/api/password-reset', { method: 'POST', body }),
  });
}
