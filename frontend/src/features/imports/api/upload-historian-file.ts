import { uploadFile, type UploadHandle } from '@frontend/lib/api-client';
import type { UploadResponse } from '@shared/schemas/imports';

export type { UploadResponse };
export type ColumnGuess = UploadResponse['guess']['columns'][number];

/** POST /api/units/:id/uploads with upload progress; the server answers the columns, first rows and a proposed mapping. */
export const uploadHistorianFile = (unitId: string, file: File, onProgress: (fraction: number) => void): UploadHandle<UploadResponse> =>
  uploadFile<UploadResponse>(`/api/units/${unitId}/uploads`, file, onProgress);

/**
 * Several files of one tag each to the same request, each in a field named `file`, with upload progress; the server
 * answers the files, their tags and a proposed tag mapping.
 */
export const uploadHistorianFiles = (unitId: string, files: File[], onProgress: (fraction: number) => void): UploadHandle<UploadResponse> =>
  uploadFile<UploadResponse>(`/api/units/${unitId}/uploads`, files, onProgress);
