import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { OutageView } from '@shared/schemas/outages';
import { outageKey, outagesKey } from './outage-keys';

const isOutageView = (answer: unknown): answer is OutageView =>
  typeof answer === 'object' && answer !== null && 'id' in answer && 'items' in answer && 'actions' in answer;

/**
 * A write on an outage or one of its items. Most answer the whole outage, which goes straight into the cache; the
 * outage and every list under the organisation's outages are read again afterwards either way, so the page always
 * shows the server's figures (the repriced benefit, a proposal marked out of date, the saved scopes' totals).
 */
export function useOutageChange<Body, Answer = unknown>(organisationId: string, request: (body: Body) => { path: string; method: string; body?: unknown }) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Body) => {
      const r = request(body);
      return api<Answer>(r.path, { method: r.method, body: r.body });
    },
    onSuccess: async (answer) => {
      const invalidated = queryClient.invalidateQueries({ queryKey: outagesKey(organisationId) });
      // an answer that is the whole outage is already fresh: the form that sent it resets at once, the lists follow
      if (isOutageView(answer)) queryClient.setQueryData(outageKey(organisationId, answer.id), answer);
      else await invalidated;
    },
  });
}
