import { useMutation } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';

/** Stripe's Checkout page for a plan, or its billing portal, opened in this tab. */
export function useOpenStripePage() {
  return useMutation({
    mutationFn: (to: { page: 'checkout'; price: string } | { page: 'portal' }) =>
      api<{ url: string }>(`/api/billing/${to.page}`, { method: 'POST', body: to.page === 'checkout' ? { price: to.price } : undefined }),
    onSuccess: ({ url }) => window.location.assign(url),
  });
}
