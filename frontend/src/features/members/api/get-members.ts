import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MembersResponse } from '@shared/schemas/accounts';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

export const membersQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'members'],
    queryFn: () => api<MembersResponse>('/api/members').then((r) => r.members),
  });

export const useMembers = (organisationId: string) => useQuery(membersQueryOptions(organisationId));
