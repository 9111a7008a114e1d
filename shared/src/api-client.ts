import { defaultErrorCode, ERROR_CODE_STATUS, type ErrorCode } from './error-codes';

/** A code from the API's list, or `unreachable`: the apps' own, when no answer arrived at all. */
export type ClientErrorCode = ErrorCode | 'unreachable';

/**
 * The one HTTP client both apps use to reach /api. It sends the session cookie, speaks JSON, and
 * turns every non-2xx answer into an ApiError: a stable `code` to branch on (ERROR_CODES) and a
 * message written for people.
 */
/** One problem of a `validation_failed` answer: the field's path ("pedals[3].currentMa") and its words. */
export interface ApiFieldIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  readonly code: ClientErrorCode;

  constructor(
    readonly status: number,
    message: string,
    readonly details: string[] = [],
    code?: ClientErrorCode,
    /** Each problem with its field's path, when the answer names them (`validation_failed`). */
    readonly issues: ApiFieldIssue[] = [],
    /** The answer's Retry-After in seconds (a 429 or 503 says how long to wait), when it gave one. */
    readonly retryAfterSeconds?: number,
  ) {
    super(message);
    this.name = 'ApiError';
    this.code = code ?? (status === 0 ? 'unreachable' : defaultErrorCode(status));
  }
}

/** True when an error is an ApiError carrying one of the given codes. */
export const hasErrorCode = (error: unknown, ...codes: ClientErrorCode[]): error is ApiError =>
  error instanceof ApiError && codes.includes(error.code);

/** Nobody is signed in, or the session was ended: a 401 of any kind. */
export const isSignedOutError = (error: unknown) => hasErrorCode(error, 'not_signed_in', 'session_ended');

/** The shop is not answering (its database is down) or could not be reached at all. */
export const isShopAwayError = (error: unknown) => hasErrorCode(error, 'shop_unavailable', 'unreachable');

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  query?: Record<string, string | number | boolean | undefined | null>;
}

export interface ApiClient {
  request<T>(path: string, options?: RequestOptions): Promise<T>;
  get<T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
  post<T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>): Promise<T>;
}

/**
 * An ApiError from an error answer's status and body (`{ statusCode, code, message, details?, issues? }`),
 * and its Retry-After header when it has one (whole seconds; the date form is not read).
 */
export function apiErrorFrom(status: number, body: unknown, retryAfter?: string | null): ApiError {
  const given =
    body && typeof body === 'object' ? (body as { code?: unknown; message?: unknown; details?: unknown; issues?: unknown }) : {};
  // Known codes are looked up in ERROR_CODE_STATUS (code → status), not ERROR_CODES: this client is in
  // every page's first load, and the codes' descriptions (1.3 kB gzipped) are for the API document.
  const code = typeof given.code === 'string' && Object.hasOwn(ERROR_CODE_STATUS, given.code) ? (given.code as ErrorCode) : undefined;
  const details = Array.isArray(given.details) ? given.details.map(String) : Array.isArray(given.message) ? given.message.map(String) : [];
  const message =
    typeof given.message === 'string' && given.message
      ? given.message
      : details.length > 0
        ? details.join('; ')
        : status >= 500
          ? 'The shop’s server had a problem; please try again in a moment.'
          : `The request was refused (HTTP ${status}).`;
  const issues = Array.isArray(given.issues)
    ? given.issues.filter(
        (issue): issue is ApiFieldIssue => Boolean(issue) && typeof issue.path === 'string' && typeof issue.message === 'string',
      )
    : [];
  return new ApiError(
    status,
    message,
    details,
    code,
    issues.map(({ path, message }) => ({ path, message })),
    retryAfter && /^\d+$/.test(retryAfter.trim()) ? Number(retryAfter) : undefined,
  );
}

export function createApiClient(baseUrl = '/api', fetchImpl: typeof fetch = (...a) => fetch(...a)): ApiClient {
  async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
    const url = new URL(`${baseUrl}${path}`, typeof window === 'undefined' ? 'http://localhost' : window.location.origin);
    for (const [key, value] of Object.entries(options.query ?? {})) {
      if (value !== undefined && value !== null && value !== '') url.searchParams.set(key, String(value));
    }
    const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
    // The request starts in a task of its own: calls are made from React's effects and renders (a
    // query subscribing, a prefetch), and starting a fetch costs the main thread a few ms each, which
    // would lengthen the render or commit that asked (on a page's first load, several at once).
    await new Promise<void>((resolve) => setTimeout(resolve, 0));
    let response: Response;
    try {
      response = await fetchImpl(url.toString(), {
        method: options.method ?? 'GET',
        credentials: 'same-origin',
        // Every state-changing call says it speaks JSON, even with no body: the API refuses other
        // types (and none) with 415, because a page on another site can send those without a preflight.
        // A FormData upload sets its own multipart type and boundary.
        headers: (options.method ?? 'GET') !== 'GET' && !isForm ? { 'Content-Type': 'application/json' } : undefined,
        body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
        signal: options.signal,
      });
    } catch (error) {
      if ((error as Error).name === 'AbortError') throw error;
      throw new ApiError(0, 'The shop could not be reached; check your connection and try again.');
    }
    const text = await response.text();
    const body = text ? safeJson(text) : undefined;
    if (!response.ok) {
      throw apiErrorFrom(response.status, body, response.headers.get('Retry-After'));
    }
    return body as T;
  }
  return {
    request,
    get: (path, options) => request(path, { ...options, method: 'GET' }),
    post: (path, body, options) => request(path, { ...options, method: 'POST', body }),
  };
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return { message: text };
  }
}
