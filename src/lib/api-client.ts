import type { ApiError } from '@shared/api-error';
import { i18n } from '@/i18n';
import enCommon from '@/locales/en/common.json';
import { issueMessage, type IssueFacts } from './validation-messages';

type Reason = keyof typeof enCommon.apiErrors.reasons;
type FieldReason = keyof typeof enCommon.apiErrors.fields;
type Params = Record<string, string | number>;

const isReason = (r: string | undefined): r is Reason => r !== undefined && Object.hasOwn(enCommon.apiErrors.reasons, r);
const isFieldReason = (r: string | undefined): r is FieldReason => r !== undefined && Object.hasOwn(enCommon.apiErrors.fields, r);

/** Codes whose message never names a particular case: worded by the code alone. */
const GENERIC_CODES = ['unauthenticated', 'csrf_invalid', 'service_unavailable', 'internal_error'] as const;
type GenericCode = (typeof GENERIC_CODES)[number];
const isGenericCode = (c: string): c is GenericCode => (GENERIC_CODES as readonly string[]).includes(c);

interface FieldDetail {
  path?: string;
  message?: string;
  reason?: string;
  issue?: IssueFacts;
}

/**
 * The reader's words for a failure the server sent: by its `reason` (the exact case), else by a
 * code that means one thing only, else the server's own (English) text. A schema check the
 * server made (`validation_failed` whose details all carry the issue facts) reads as the form's.
 */
function localizedMessage(code: string, serverMessage: string, reason?: string, params?: Params, details?: unknown): string {
  if (isReason(reason)) return i18n.t(($) => $.apiErrors.reasons[reason], Object.fromEntries(Object.entries(params ?? {}).map(([k, v]) => [k, String(v)])));
  if (isGenericCode(code)) return i18n.t(($) => $.apiErrors.codes[code]);
  if (code === 'validation_failed' && Array.isArray(details) && details.length > 0 && (details as FieldDetail[]).every((d) => d?.issue)) {
    return i18n.t(($) => $.apiErrors.reasons.invalid_fields);
  }
  return serverMessage;
}

function localizedFieldMessage(d: FieldDetail): string | undefined {
  if (isFieldReason(d.reason)) return i18n.t(($) => $.apiErrors.fields[d.reason as FieldReason]);
  if (d.issue && typeof d.issue.code === 'string') return issueMessage(d.issue);
  return d.message;
}

/**
 * An API failure with the server's code, message and field details. `message` is in the
 * reader's language where the case is known (see `localizedMessage`); `serverMessage` keeps the
 * server's words.
 */
export class ApiRequestError extends Error {
  readonly serverMessage: string;
  readonly reason?: string;
  readonly params?: Params;
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    extra: { reason?: string; params?: Params } = {},
  ) {
    super(localizedMessage(code, message, extra.reason, extra.params, details));
    this.serverMessage = message;
    this.reason = extra.reason;
    this.params = extra.params;
  }

  /** Field-level messages keyed by field path, for forms, in the reader's language where known. */
  get fieldErrors(): Record<string, string> {
    const out: Record<string, string> = {};
    if (Array.isArray(this.details)) {
      for (const d of this.details as FieldDetail[]) {
        const message = d?.path ? localizedFieldMessage(d) : undefined;
        if (d.path && message && !out[d.path]) out[d.path] = message;
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
    throw new ApiRequestError(0, 'network_error', i18n.t(($) => $.apiErrors.network));
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
    throw new ApiRequestError(res.status, err?.code ?? 'http_error', err?.message ?? i18n.t(($) => $.apiErrors.http, { status: res.status }), err?.details, { reason: err?.reason, params: err?.params });
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
