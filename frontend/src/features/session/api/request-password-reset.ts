import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequest } from '@shared/schemas/accounts';
import type { MessageResponse } from '@shared/schemas/errors';
import { api } from '@frontend/lib/api-client';

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (body: PasswordResetRequest) => api<MessageResponse>('/api/password-reset', { method: 'POST', body }),
  });
}
