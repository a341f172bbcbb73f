import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import { unitKey } from '@frontend/lib/query-keys';
import type { ImportView } from './get-import';

/** DELETE /api/imports/:id: removes the rows the import brought and recomputes the unit. */
export function useUndoImport(organisationId: string, unitId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (importId: string) => api<ImportView>(`/api/imports/${importId}`, { method: 'DELETE' }),
    // the history, the unit's data span and its recompute job all change
    onSettled: () => queryClient.invalidateQueries({ queryKey: unitKey(organisationId, unitId) }),
  });
}
