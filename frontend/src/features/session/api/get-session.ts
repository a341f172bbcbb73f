import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SessionResponse } from '@shared/schemas/session';
import { api } from '@frontend/lib/api-client';

export const sessionQueryOptions = () =>
  queryOptions({ queryKey: ['session'], queryFn: () => api<SessionResponse>('/api/session'), staleTime: 60_000 });

export const useSession = () => useQuery(sessionQueryOptions());
