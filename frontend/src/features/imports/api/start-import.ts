import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ImportMappingInput } from '@shared/schemas/import-mapping';
import { api } from '@frontend/lib/api-client';
import { importQueryOptions, type ImportView } from './get-import';

export function useStartImport(organisationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ importId, mapping }: { importId: string; mapping: ImportMappingInput }) =>
      api<ImportView>(`/api/imports/${importId}/start`, { method: 'POST', body: { mapping } }),
    onSuccess: (view) => queryClient.setQueryData(importQueryOptions(organisationId, view.id).queryKey, view),
  });
}
