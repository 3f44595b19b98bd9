/** Multipart uploads with progress (XHR: fetch has no upload progress), with the CSRF retry of the API client. */
import { ApiError, getCsrfToken } from '../../../lib/api-client';

/** Upload progress from 0 to 1, or null while the server reads the file after the upload. */
export type UploadProgress = (fraction: number | null) => void;

function send(url: string, form: FormData, token: string, onProgress?: UploadProgress): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.setRequestHeader('X-CSRF-Token', token);
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => onProgress?.(e.lengthComputable ? e.loaded / e.total : null);
    xhr.upload.onload = () => onProgress?.(null);
    xhr.onerror = () => reject(new ApiError(0, 'Browseline cannot be reached. Check your connection and try again.', 'network'));
    xhr.onload = () => {
      let body: unknown;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      resolve({ status: xhr.status, body });
    };
    xhr.send(form);
  });
}

/**
 * POSTs a form with upload progress and answers `data` of a 2xx answer; otherwise throws an
 * ApiError with the server's sentence (or `tooLarge` for a 413 without one).
 */
export async function uploadForm<T>(url: string, makeForm: () => FormData, onProgress: UploadProgress | undefined, tooLarge: string): Promise<T> {
  let res = await send(url, makeForm(), await getCsrfToken(), onProgress);
  const code = (res.body as { code?: string } | null)?.code;
  if (res.status === 403 && code === 'csrf') res = await send(url, makeForm(), await getCsrfToken(true), onProgress);
  if (res.status >= 200 && res.status < 300) return (res.body as { data: T }).data;
  const p = (res.body ?? {}) as { error?: string; code?: string; details?: unknown };
  throw new ApiError(res.status, p.error ?? (res.status === 413 ? tooLarge : `The server answered ${res.status}. Please try again.`), p.code, p.details);
}
