import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { NotificationSettingsResponse } from '@shared/schemas/notifications';

/** Your own e-mail alert choices in the active organisation; keyed by organisation so tenants never share an entry. */
export const notificationsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'notifications'] as const,
    queryFn: () => api<NotificationSettingsResponse>('/api/notifications'),
  });

export const useNotifications = (organisationId: string) => useQuery(notificationsQueryOptions(organisationId));
