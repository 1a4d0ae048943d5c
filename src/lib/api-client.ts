/**
 * The one way the client talks to the server: JSON over same-origin fetch.
 * Failures become an ApiError carrying the server's stable `code`, so pages
 * can react to 401, 403 and field errors without parsing messages.
 */

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  readonly requestId: string | undefined;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}, requestId?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.requestId = requestId;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

// The CSRF token arrives in the login / me body and is held in memory only:
// a fresh page load asks /api/auth/me again and gets it back.
let csrfToken: string | null = null;

export function setCsrfToken(token: string | null): void {
  csrfToken = token;
}

/** For requests made outside `request` (an upload through XMLHttpRequest, for its progress events). */
export function getCsrfToken(): string | null {
  return csrfToken;
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions {
  body?: unknown;
  signal?: AbortSignal;
}

/** 401s seen outside the sign-in check itself are reported here (set by the app). */
let onUnauthenticated: (() => void) | null = null;
export function setUnauthenticatedHandler(handler: (() => void) | null): void {
  onUnauthenticated = handler;
}

interface ErrorBody {
  error?: { code?: string; message?: string; fields?: Record<string, string>; requestId?: string };
}

async function request<T>(method: Method, url: string, { body, signal }: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && csrfToken) headers['X-CSRF-Token'] = csrfToken;

  let response: Response;
  try {
    response = await fetch(url, {
      method,
      headers,
      credentials: 'same-origin',
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new ApiError(0, 'network', 'Could not reach the server. Check your connection and try again.');
  }

  if (response.status === 204) return undefined as T;
  const text = await response.text();
  let data: unknown = null;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = null;
    }
  }
  if (!response.ok) {
    const e = (data as ErrorBody | null)?.error ?? {};
    const error = new ApiError(
      response.status,
      e.code ?? `http_${response.status}`,
      e.message ?? `The server answered ${response.status} ${response.statusText}.`,
      e.fields ?? {},
      e.requestId,
    );
    if (response.status === 401 && onUnauthenticated) onUnauthenticated();
    throw error;
  }
  return data as T;
}

export const apiClient = {
  get: <T>(url: string, opts?: Omit<RequestOptions, 'body'>) => request<T>('GET', url, opts),
  post: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('POST', url, { ...opts, body }),
  put: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('PUT', url, { ...opts, body }),
  patch: <T>(url: string, body?: unknown, opts?: RequestOptions) => request<T>('PATCH', url, { ...opts, body }),
  delete: <T = void>(url: string, opts?: RequestOptions) => request<T>('DELETE', url, opts),
};
