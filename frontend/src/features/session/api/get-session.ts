import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';

export const sessionQueryOptions = () => queryOptions({ queryKey: ['session'], queryFn: () => api<SessionResponse>('/api/session'), staleTime: 60_000 });

export const useSession = () => useQuery(sessionQueryOptions());

/** Whether the person's access in the active organisation is limited to client groups. */
export function limitedToClientGroups(session: SessionResponse | undefined): boolean {
  return session?.memberships.find((m) => m.organisationId === session.activeOrganisationId)?.limitedToClientGroups ?? false;
}

/**
 * After the person or the active organisation changed: drop every cached answer (all of it may belong to
 * the previous tenant) and keep only the new session.
 */
export function replaceSession(queryClient: QueryClient, session: SessionResponse): void {
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'session' });
  queryClient.setQueryData(sessionQueryOptions().queryKey, session);
}

export const SIGNED_OUT_SESSION = (devMailbox: boolean): SessionResponse => ({
  user: null,
  activeOrganisationId: null,
  permissions: [],
  memberships: [],
  devMailbox,
});
