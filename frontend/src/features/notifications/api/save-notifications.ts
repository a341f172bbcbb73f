import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { NotificationSettingsBody, NotificationSettingsResponse } from '@shared/schemas/notifications';
import { notificationsQueryOptions } from './get-notifications';

export function useSaveNotifications(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: NotificationSettingsBody) => api<NotificationSettingsResponse>('/api/notifications', { method: 'PUT', body }),
    onSuccess: (saved) => queryClient.setQueryData(notificationsQueryOptions(organisationId).queryKey, saved),
  });
}
