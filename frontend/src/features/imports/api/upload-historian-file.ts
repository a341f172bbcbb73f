import type { ImportMappingInput } from '@shared/schemas/import-mapping';
import { uploadFile, type UploadHandle } from '@frontend/lib/api-client';
import type { ImportView } from './get-import';

export interface ColumnGuess {
  header: string;
  index: number;
  quantity: string | null;
  unit: string | null;
  /** 0 to 1. */
  confidence: number;
  note?: string;
}

export interface UploadResponse {
  import: ImportView;
  headers: string[];
  sampleRows: string[][];
  guess: { columns: ColumnGuess[]; mapping: ImportMappingInput; complete: boolean; problems: string[] };
  proposedMapping: ImportMappingInput;
  /** 'saved': the unit's mapping from the last import fits this file. */
  mappingSource: 'saved' | 'guessed';
}

/** POST /api/units/:id/uploads with upload progress; the server answers the columns, first rows and a proposed mapping. */
export const uploadHistorianFile = (unitId: string, file: File, onProgress: (fraction: number) => void): UploadHandle<UploadResponse> =>
  uploadFile<UploadResponse>(`/api/units/${unitId}/uploads`, file, onProgress);
