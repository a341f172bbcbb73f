/** The one way the browser talks to the API: JSON, same-origin cookies, our CSRF header on unsafe calls. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details?: { fieldErrors?: { path: string; message: string }[] },
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init: { method?: string; body?: unknown } = {}): Promise<T> {
  const method = init.method ?? 'GET';
  const headers: Record<string, string> = { accept: 'application/json' };
  if (method !== 'GET') headers['x-cleancase-request'] = '1';
  if (init.body !== undefined) headers['content-type'] = 'application/json';
  const res = await fetch(path, {
    method,
    headers,
    credentials: 'same-origin',
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (res.status === 204) return undefined as T;
  const data = await res.json().catch(() => ({}));
  if (!res.ok) throw new ApiError(res.status, data.error ?? `Request failed (${res.status})`, data.details);
  return data as T;
}

export interface UploadHandle<T> {
  promise: Promise<T>;
  abort: () => void;
}

/**
 * Sends a file (or several, each in its own field) as multipart (fields named `file`) with our CSRF header.
 * XMLHttpRequest rather than fetch because only it reports upload progress; `onProgress` gets the sent fraction, 0 to 1.
 */
export function uploadFile<T>(path: string, file: File | readonly File[], onProgress: (fraction: number) => void): UploadHandle<T> {
  const xhr = new XMLHttpRequest();
  const promise = new Promise<T>((resolve, reject) => {
    xhr.open('POST', path);
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
      if (xhr.status >= 200 && xhr.status < 300) resolve(data as T);
      else reject(new ApiError(xhr.status, data.error ?? `Upload failed (${xhr.status})`, data.details));
    };
    xhr.onerror = () => reject(new ApiError(0, 'The upload was interrupted; check the connection and try again'));
    xhr.onabort = () => reject(new ApiError(0, 'Upload cancelled'));
    const body = new FormData();
    for (const f of Array.isArray(file) ? file : [file]) body.append('file', f);
    xhr.send(body);
  });
  return { promise, abort: () => xhr.abort() };
}
