import { useMutation } from '@tanstack/react-query';
import { api } from '@frontend/lib/api-client';
import type { UploadResponse } from './upload-historian-file';

/** POST /api/imports/:id/sheet: reads another sheet of the uploaded workbook and proposes its mapping. */
export const useChooseSheet = () =>
  useMutation({
    mutationFn: ({ importId, sheet }: { importId: string; sheet: string }) =>
      api<UploadResponse>(`/api/imports/${importId}/sheet`, { method: 'POST', body: { sheet } }),
  });
