import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirm } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';

/** Sets a new password from a reset link; the server ends every session of the account. */
export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (body: PasswordResetConfirm) => api<void>('/api/password-reset/confirm', { method: 'POST', body }),
  });
}
