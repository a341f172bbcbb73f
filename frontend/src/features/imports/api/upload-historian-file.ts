import { ApiError, uploadFile, type UploadHandle } from '@frontend/lib/api-client';
import type { UploadResponse } from '@shared/schemas/imports';

export type { UploadResponse };
export type ColumnGuess = UploadResponse['guess']['columns'][number];

/** POST /api/units/:id/uploads with upload progress; the server answers the columns, first rows and a proposed mapping. */
export const uploadHistorianFile = (unitId: string, file: File, onProgress: (fraction: number) => void): UploadHandle<UploadResponse> =>
  uploadFile<UploadResponse>(`/api/units/${unitId}/uploads`, file, onProgress);

/**
 * Several files of one tag each to the same request, each in a field named `file`, with upload progress; the server
 * answers the files, their tags and a proposed tag mapping. One file goes as `uploadHistorianFile` does.
 */
export function uploadHistorianFiles(unitId: string, files: File[], onProgress: (fraction: number) => void): UploadHandle<UploadResponse> {
  if (files.length === 1) return uploadHistorianFile(unitId, files[0]!, onProgress);
  const xhr = new XMLHttpRequest();
  const promise = new Promise<UploadResponse>((resolve, reject) => {
    xhr.open('POST', `/api/units/${unitId}/uploads`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.setRequestHeader('x-cleancase-request', '1');
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => {
      let data: { error?: string; details?: ApiError['details'] } = {};
      try {
        data = JSON.parse(xhr.responseText);
      } catch {
        // a proxy's HTML error page: fall back to the status below
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(data as UploadResponse);
      else reject(new ApiError(xhr.status, data.error ?? `Upload failed (${xhr.status})`, data.details));
    };
    xhr.onerror = () => reject(new ApiError(0, 'The upload was interrupted; check the connection and try again'));
    xhr.onabort = () => reject(new ApiError(0, 'Upload cancelled'));
    const body = new FormData();
    for (const f of files) body.append('file', f);
    xhr.send(body);
  });
  return { promise, abort: () => xhr.abort() };
}
