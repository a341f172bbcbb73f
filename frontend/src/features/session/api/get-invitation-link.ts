import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Role } from '@shared/permissions';
import { api } from '@frontend/lib/api-client';

export interface InvitationLinkView {
  email: string;
  role: Role;
  organisationName: string;
  accountExists: boolean;
  expiresAt: string;
}

export const invitationLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitation-links', token],
    queryFn: () => api<InvitationLinkView>(`/api/invitation-links/${encodeURIComponent(token)}`),
    staleTime: 0,
    // A dead link stays dead: do not ask again when the page mounts after the loader already failed.
    retryOnMount: false,
  });

export const useInvitationLink = (token: string) => useQuery(invitationLinkQueryOptions(token));
