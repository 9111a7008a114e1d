/**
 * The one HTTP client both apps use to reach /api. It sends the session cookie, speaks JSON, and
 * turns every non-2xx answer into an ApiError whose message is written for people.
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details: string[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

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

function messageOf(status: number, body: unknown): { message: string; details: string[] } {
  if (body && typeof body === 'object' && 'message' in body) {
    const raw = (body as { message: unknown }).message;
    if (Array.isArray(raw)) return { message: raw.map(String).join('; '), details: raw.map(String) };
    if (typeof raw === 'string') return { message: raw, details: [] };
  }
  if (status >= 500) return { message: 'The shop’s server had a problem; please try again in a moment.', details: [] };
  return { message: `The request was refused (HTTP ${status}).`, details: [] };
}

export function createApiClient(baseUrl = '/api', fetchImpl: typeof fetch = (...a) => fetch(...a)): ApiClient {
  async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
    const url = new URL(`${baseUrl}${path}`, typeof window === 'undefined' ? 'http://localhost' : window.location.origin);
    for (const [key, value] of Object.entries(options.query ?? {})) {
      if (value !== undefined && value !== null && value !== '') url.searchParams.set(key, String(value));
    }
    const isForm = typeof FormData !== 'undefined' && options.body instanceof FormData;
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
      const { message, details } = messageOf(response.status, body);
      throw new ApiError(response.status, message, details);
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
