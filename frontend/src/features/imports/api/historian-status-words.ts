import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { StatusWordsResponse } from '@shared/schemas/historian-status';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';

/** The historian status words an import of the organisation treats as a missing value: the defaults and its own. */
export const statusWordsQueryOptions = (organisationId: string) =>
  queryOptions({
    queryKey: [...organisationKey(organisationId), 'historian-status-words'],
    queryFn: () => api<StatusWordsResponse>('/api/organisation/historian-status-words'),
  });

export const useStatusWords = (organisationId: string) => useQuery(statusWordsQueryOptions(organisationId));

/** Replaces the organisation's own words (administrators). */
export function useSaveStatusWords(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (words: string[]) => api<StatusWordsResponse>('/api/organisation/historian-status-words', { method: 'PUT', body: { words } }),
    onSuccess: (view) => queryClient.setQueryData(statusWordsQueryOptions(organisationId).queryKey, view),
  });
}
