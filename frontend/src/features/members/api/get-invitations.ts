import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationsResponse } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export const invitationsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'invitations'],
    queryFn: () => api<InvitationsResponse>('/api/invitations').then((r) => r.invitations),
  });

export const useInvitations = (organisationId: string) => useQuery(invitationsQueryOptions(organisationId));
