import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UnitInput } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { organisationKey } from '@frontend/lib/query-keys';
import type { UnitListItem } from './get-plants';

export function useRenameUnit(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, name }: UnitInput & { id: string }) => api<UnitListItem>(`/api/units/${id}`, { method: 'PATCH', body: { name } }),
    // the plant list and the unit's own page both show the name
    onSuccess: () => queryClient.invalidateQueries({ queryKey: organisationKey(organisationId) }),
  });
}
