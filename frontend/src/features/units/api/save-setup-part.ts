import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CondenserSetup, EconomicsSetup, TurbineSetup } from '@shared/schemas/unit-setup';
import { api } from '@frontend/lib/api-client';
import { plantsKey } from '@frontend/lib/query-keys';
import { unitQueryOptions, type UnitDetail } from './get-unit';

type Parts = { condenser: CondenserSetup; turbine: TurbineSetup; economics: EconomicsSetup };

/** PUT /api/units/:id/{condenser|turbine|economics}: answers the unit with its queued recompute. */
export function useSaveSetupPart<P extends keyof Parts>(organisationId: string, unitId: string, part: P) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: Parts[P]) => api<UnitDetail>(`/api/units/${unitId}/${part}`, { method: 'PUT', body }),
    onSuccess: (unit) => {
      queryClient.setQueryData(unitQueryOptions(organisationId, unitId).queryKey, unit);
      // the plant list shows rating and setup completeness
      void queryClient.invalidateQueries({ queryKey: plantsKey(organisationId) });
    },
  });
}
