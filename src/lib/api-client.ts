/** The typed API client: JSON in and out, the CSRF token on writes, typed errors for every failure. */

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly code?: string,
    public readonly details?: unknown,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;

/** Remembers the CSRF token the server handed out (sign-in answers carry a fresh one). */
export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  csrfToken = body.csrfToken;
  return csrfToken;
}

/** The CSRF token for a write made outside `api` (an XMLHttpRequest upload with progress). */
export async function getCsrfToken(refresh = false): Promise<string> {
  return !refresh && csrfToken ? csrfToken : fetchCsrfToken();
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
  /** FormData bodies go as multipart. */
  form?: FormData;
  headers?: Record<string, string>;
}

async function request<T>(method: Method, url: string, options: RequestOptions = {}, retried = false): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  let body: BodyInit | undefined;
  if (options.form) body = options.form;
  else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(options.body);
  }
  if (method !== 'GET') headers['X-CSRF-Token'] = csrfToken ?? (await fetchCsrfToken());

  let res: Response;
  try {
    res = await fetch(url, { method, headers, body, credentials: 'same-origin', signal: options.signal });
  } catch (err) {
    if ((err as Error).name === 'AbortError') throw err;
    throw new ApiError(0, 'Browseline cannot be reached. Check your connection and try again.', 'network');
  }
  if (res.status === 204) return undefined as T;
  const isJson = res.headers.get('content-type')?.includes('application/json');
  const payload = isJson ? await res.json().catch(() => null) : null;
  if (!res.ok) {
    const p = (payload ?? {}) as { error?: string; code?: string; details?: unknown };
    if (res.status === 403 && p.code === 'csrf' && !retried) {
      await fetchCsrfToken();
      return request<T>(method, url, options, true);
    }
    throw new ApiError(res.status, p.error ?? `The server answered ${res.status}. Please try again.`, p.code, p.details);
  }
  return payload as T;
}

export const api = {
  get: <T>(url: string, signal?: AbortSignal) => request<T>('GET', url, { signal }),
  post: <T>(url: string, body?: unknown) => request<T>('POST', url, { body: body ?? {} }),
  put: <T>(url: string, body?: unknown) => request<T>('PUT', url, { body }),
  patch: <T>(url: string, body?: unknown) => request<T>('PATCH', url, { body }),
  delete: <T>(url: string) => request<T>('DELETE', url),
  upload: <T>(url: string, form: FormData, headers?: Record<string, string>) => request<T>('POST', url, { form, headers }),
  postWithHeaders: <T>(url: string, body: unknown, headers: Record<string, string>) => request<T>('POST', url, { body, headers }),
};

/** The `data` member of a successful answer. */
export async function getData<T>(url: string, signal?: AbortSignal): Promise<T> {
  const body = await api.get<{ data: T }>(url, signal);
  return body.data;
}
