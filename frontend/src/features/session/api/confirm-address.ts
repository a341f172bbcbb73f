import { useMutation } from '@tanstack/react-query';
import type { AddressConfirmation } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';

/** Confirms the account's e-mail address with the link mailed after sign-up. */
export function useConfirmAddress() {
  return useMutation({
    mutationFn: (body: AddressConfirmation) => api<void>('/api/address-confirmations', { method: 'POST', body }),
  });
}
