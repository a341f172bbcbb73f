import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BillingOverview } from '@shared/schemas/billing';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

/** The subscription as the administrator sees it: plan, status, usage, invoices and the plans on offer. */
export const billingQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'billing'],
    queryFn: () => api<BillingOverview>('/api/billing'),
  });

/** After paying on Stripe's page, the confirmation arrives by webhook a moment later: `awaitPayment` looks again until it has. */
export const useBilling = (organisationId: string, awaitPayment = false) =>
  useQuery({
    ...billingQueryOptions(organisationId),
    refetchInterval: (q) => (awaitPayment && q.state.data && !['active', 'past_due'].includes(q.state.data.status) ? 1500 : false),
  });
