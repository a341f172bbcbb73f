import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export type SubscriptionChange = { kind: 'change'; price: string } | { kind: 'cancel' } | { kind: 'resume' };

/** Another plan, ending at the period end, or keeping it after all. */
export function useChangeSubscription(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (change: SubscriptionChange) =>
      api<void>(`/api/billing/${change.kind}`, { method: 'POST', body: change.kind === 'change' ? { price: change.price } : undefined }),
    // Limits and read-only mode may have changed: the organisation's data is read again.
    onSettled: () => queryClient.invalidateQueries({ queryKey: organisationKey(organisationId) }),
  });
}
