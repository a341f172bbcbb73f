import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { InvitationLinkView } from '@shared/schemas/accounts';

export type { InvitationLinkView };

export const invitationLinkQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['invitation-links', token],
    queryFn: () => api<InvitationLinkView>(`/api/invitation-links/${encodeURIComponent(token)}`),
    staleTime: 0,
    // A dead link stays dead: do not ask again when the page mounts after the loader already failed.
    retryOnMount: false,
  });

export const useInvitationLink = (token: string) => useQuery(invitationLinkQueryOptions(token));
