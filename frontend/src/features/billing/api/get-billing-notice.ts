import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BillingNotice } from '@shared/schemas/billing';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

/** What every member is told about the subscription (read-only, the trial's last days). */
export const billingNoticeQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'billing', 'notice'],
    queryFn: () => api<BillingNotice>('/api/billing/notice'),
    staleTime: 5 * 60 * 1000,
  });

export const useBillingNotice = (organisationId: string | null | undefined) =>
  useQuery({ ...billingNoticeQueryOptions(organisationId ?? ''), enabled: !!organisationId });
