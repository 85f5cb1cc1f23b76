import type { ApiError } from '@shared/api-error';

/** An API failure with the server's code, message and field details. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }

  /** Field-level messages keyed by field path, for forms. */
  get fieldErrors(): Record<string, string> {
    const out: Record<string, string> = {};
    if (Array.isArray(this.details)) {
      for (const d of this.details as { path?: string; message?: string }[]) {
        if (d.path && d.message && !out[d.path]) out[d.path] = d.message;
      }
    }
    return out;
  }
}

let csrfToken: string | null = null;
/** The session's CSRF token, sent on every state-changing request. Set from /api/auth/session. */
export function setCsrfToken(token: string | null) {
  csrfToken = token;
}

/** For requests that cannot go through fetch (upload progress needs XMLHttpRequest). */
export function getCsrfToken(): string | null {
  return csrfToken;
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

/** A successful response body: the data and, for lists, paging or availability facts. */
export interface ApiEnvelope<T, M = Record<string, unknown>> {
  data: T;
  meta?: M;
}

/**
 * Fetches the session's CSRF token when none is held: a page restored from this phone's storage
 * (a Round saved offline, sent after a reload) has not read /api/auth/session yet. Concurrent
 * callers share one request.
 */
let tokenRequest: Promise<void> | null = null;
function refreshCsrfToken(): Promise<void> {
  tokenRequest ??= fetch('/api/auth/session', { credentials: 'same-origin', headers: { Accept: 'application/json' } })
    .then(async (res) => {
      const token = res.ok ? ((await res.json()) as { data?: { csrfToken?: string } }).data?.csrfToken : undefined;
      if (token) csrfToken = token;
    })
    .catch(() => undefined)
    .finally(() => {
      tokenRequest = null;
    });
  return tokenRequest;
}

async function requestEnvelope<T, M>(method: Method, url: string, body?: unknown, init: RequestInit = {}, tokenRetried = false): Promise<ApiEnvelope<T, M>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const isForm = typeof FormData !== 'undefined' && body instanceof FormData;
  if (body !== undefined && !isForm) headers['Content-Type'] = 'application/json';
  if (method !== 'GET' && !csrfToken) await refreshCsrfToken();
  if (method !== 'GET' && csrfToken) headers['X-CSRF-Token'] = csrfToken;
  let res: Response;
  try {
    res = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers,
      body: body === undefined ? undefined : isForm ? (body as FormData) : JSON.stringify(body),
      ...init,
    });
  } catch {
    throw new ApiRequestError(0, 'network_error', 'Could not reach Seepwise. Check your connection and try again.');
  }
  if (res.status === 204) return { data: undefined as T };
  const text = await res.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  if (!res.ok) {
    const err = (json as ApiError | null)?.error;
    // A stale token (the session was renewed since the page read it): the CSRF check refuses before
    // any handler runs, so reading the token again and repeating the request once is safe.
    if (res.status === 403 && err?.code === 'csrf_invalid' && method !== 'GET' && !tokenRetried) {
      csrfToken = null;
      await refreshCsrfToken();
      if (csrfToken) return requestEnvelope<T, M>(method, url, body, init, true);
    }
    throw new ApiRequestError(res.status, err?.code ?? 'http_error', err?.message ?? `Request failed (${res.status}).`, err?.details);
  }
  return json as ApiEnvelope<T, M>;
}

async function request<T>(method: Method, url: string, body?: unknown, init?: RequestInit): Promise<T> {
  return (await requestEnvelope<T, unknown>(method, url, body, init)).data;
}

export const api = {
  get: <T>(url: string, init?: RequestInit) => request<T>('GET', url, undefined, init),
  /** GET keeping `meta` (totals and pages of a list). */
  getWithMeta: <T, M>(url: string, init?: RequestInit) => requestEnvelope<T, M>('GET', url, undefined, init),
  post: <T>(url: string, body?: unknown) => request<T>('POST', url, body ?? {}),
  patch: <T>(url: string, body: unknown) => request<T>('PATCH', url, body),
  put: <T>(url: string, body: unknown) => request<T>('PUT', url, body),
  delete: <T>(url: string) => request<T>('DELETE', url),
};

/** Builds a query string from defined values only. */
export function qs(params: Record<string, string | number | boolean | undefined | null>): string {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '') sp.set(k, String(v));
  const s = sp.toString();
  return s ? `?${s}` : '';
}
