import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationView } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';

export const invitationsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: ['organisations', organisationId, 'invitations'],
    queryFn: () => api<{ invitations: InvitationView[] }>('/api/invitations').then((r) => r.invitations),
  });

export const useInvitations = (organisationId: string) => useQuery(invitationsQueryOptions(organisationId));
