/**
 * The one way the web app talks to the API: same origin, JSON in and out, the session cookie,
 * and a CSRF token on every state-changing request. It only throws; deciding what the user
 * sees (a redirect, a toast, a message under a field) is left to the caller.
 */

export const API_BASE = '/api';

/** One problem with one input, as the API reports it; `path` uses dots: `observations.0.hours`. */
export interface ApiIssue {
  path: string;
  message: string;
}

/** The API's error envelope, the same for every endpoint. */
export interface ApiErrorBody {
  statusCode: number;
  code: string;
  message: string;
  issues?: ApiIssue[];
}

export class ApiError extends Error {
  override readonly name = 'ApiError';
  /** HTTP status, or 0 when no answer came (network down, request refused). */
  readonly status: number;
  /** The server's machine-readable code, e.g. `CSRF_INVALID`, or `HTTP_<status>` if it sent none. */
  readonly code: string;
  readonly issues: readonly ApiIssue[];
  /** The parsed response body as it came, for endpoints whose failures carry data (health). */
  readonly body: unknown;

  constructor(
    status: number,
    code: string,
    message: string,
    details: { issues?: readonly ApiIssue[]; body?: unknown; cause?: unknown } = {},
  ) {
    super(message, { cause: details.cause });
    this.status = status;
    this.code = code;
    this.issues = details.issues ?? [];
    this.body = details.body;
  }
}

export const isApiError = (error: unknown, status?: number): error is ApiError =>
  error instanceof ApiError && (status === undefined || error.status === status);

type QueryValue = string | number | boolean | null | undefined;

export interface RequestOptions {
  /** Appended as a query string; `undefined` and `null` values are left out. */
  query?: Record<string, QueryValue | readonly QueryValue[]>;
  headers?: Record<string, string>;
  signal?: AbortSignal;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const CSRF_HEADER = 'X-CSRF-Token';

export function apiUrl(path: string, query?: RequestOptions['query']): string {
  const url = `${API_BASE}${path.startsWith('/') ? path : `/${path}`}`;
  if (!query) return url;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    for (const item of Array.isArray(value) ? value : [value]) {
      if (item !== undefined && item !== null) params.append(key, String(item));
    }
  }
  const search = params.toString();
  return search ? `${url}?${search}` : url;
}

function parseBody(text: string, contentType: string | null): unknown {
  if (text === '') return undefined;
  if (contentType?.includes('json')) {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      return text;
    }
  }
  return text;
}

function isErrorBody(body: unknown): body is ApiErrorBody {
  return (
    typeof body === 'object' &&
    body !== null &&
    typeof (body as ApiErrorBody).code === 'string' &&
    typeof (body as ApiErrorBody).message === 'string'
  );
}

function toApiError(status: number, statusText: string, body: unknown): ApiError {
  if (isErrorBody(body)) {
    return new ApiError(status, body.code, body.message, { issues: body.issues, body });
  }
  return new ApiError(
    status,
    `HTTP_${status}`,
    statusText || `Request failed with status ${status}`,
    {
      body,
    },
  );
}

const networkError = (cause: unknown) =>
  new ApiError(0, 'NETWORK_ERROR', 'The server could not be reached.', { cause });

// One token per browser session, fetched on the first state-changing request. Caching the
// promise (not the value) makes concurrent first requests share one fetch.
let csrfToken: Promise<string> | null = null;

function getCsrfToken(): Promise<string> {
  csrfToken ??= send<{ token: string }>('GET', '/auth/csrf').then(
    ({ token }) => token,
    (error: unknown) => {
      csrfToken = null;
      throw error;
    },
  );
  return csrfToken;
}

/** Forget the cached CSRF token; call it when the session changes (sign-in, sign-out). */
export function resetCsrfToken(): void {
  csrfToken = null;
}

const isCsrfRejection = (error: unknown) => isApiError(error, 403) && error.code === 'CSRF_INVALID';

/**
 * Runs a request that may need the CSRF token. A rejected token (the session rotated, the server
 * restarted) is fetched again once and the request retried once; a second refusal is final.
 */
async function withCsrf<T>(
  method: string,
  run: (headers: Record<string, string>) => Promise<T>,
): Promise<T> {
  if (SAFE_METHODS.has(method)) return run({});
  try {
    return await run({ [CSRF_HEADER]: await getCsrfToken() });
  } catch (error) {
    if (!isCsrfRejection(error)) throw error;
    resetCsrfToken();
    return run({ [CSRF_HEADER]: await getCsrfToken() });
  }
}

async function send<T>(
  method: string,
  path: string,
  body?: unknown,
  options: RequestOptions = {},
  extraHeaders: Record<string, string> = {},
): Promise<T> {
  const headers: Record<string, string> = {
    Accept: 'application/json',
    ...extraHeaders,
    ...options.headers,
  };
  const init: RequestInit = { method, headers, credentials: 'same-origin', signal: options.signal };
  if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    init.body = JSON.stringify(body);
  }

  let response: Response;
  try {
    response = await fetch(apiUrl(path, options.query), init);
  } catch (error) {
    // An abort is the caller's own doing, not a network failure: let it through as it is.
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw networkError(error);
  }

  const parsed = parseBody(await response.text(), response.headers.get('content-type'));
  if (!response.ok) throw toApiError(response.status, response.statusText, parsed);
  return parsed as T;
}

function request<T>(
  method: string,
  path: string,
  body?: unknown,
  options?: RequestOptions,
): Promise<T> {
  return withCsrf(method, (csrfHeaders) => send<T>(method, path, body, options, csrfHeaders));
}

/**
 * JSON requests to `/api`. The type argument states what the endpoint answers; nothing checks it
 * at run time, so keep it next to the endpoint in the feature's `api.ts`.
 */
export const api = {
  get: <T>(path: string, options?: RequestOptions) => request<T>('GET', path, undefined, options),
  post: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    request<T>('POST', path, body, options),
  put: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    request<T>('PUT', path, body, options),
  patch: <T>(path: string, body?: unknown, options?: RequestOptions) =>
    request<T>('PATCH', path, body, options),
  delete: <T>(path: string, options?: RequestOptions) =>
    request<T>('DELETE', path, undefined, options),
};

export interface UploadProgress {
  loaded: number;
  /** Bytes to send, or `undefined` when the browser does not know. */
  total: number | undefined;
  /** 0…1, or `undefined` when the total is unknown. */
  fraction: number | undefined;
}

export interface UploadOptions {
  method?: 'POST' | 'PUT';
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/**
 * Sends a multipart form (a science-case PDF, a CSV of targets) and reports upload progress,
 * which fetch cannot do. Same errors and CSRF handling as `api`.
 */
export function upload<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  const method = options.method ?? 'POST';
  return withCsrf(method, (csrfHeaders) => sendForm<T>(method, path, form, options, csrfHeaders));
}

function sendForm<T>(
  method: string,
  path: string,
  form: FormData,
  { onProgress, signal }: UploadOptions,
  csrfHeaders: Record<string, string>,
): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    if (signal?.aborted) {
      reject(new DOMException('The upload was aborted.', 'AbortError'));
      return;
    }
    const xhr = new XMLHttpRequest();
    xhr.open(method, apiUrl(path));
    xhr.setRequestHeader('Accept', 'application/json');
    for (const [name, value] of Object.entries(csrfHeaders)) xhr.setRequestHeader(name, value);

    xhr.upload.onprogress = (event) => {
      const total = event.lengthComputable ? event.total : undefined;
      onProgress?.({
        loaded: event.loaded,
        total,
        fraction: total ? event.loaded / total : undefined,
      });
    };
    xhr.onload = () => {
      const parsed = parseBody(xhr.responseText, xhr.getResponseHeader('content-type'));
      if (xhr.status >= 200 && xhr.status < 300) resolve(parsed as T);
      else reject(toApiError(xhr.status, xhr.statusText, parsed));
    };
    xhr.onerror = () => reject(networkError(undefined));
    xhr.onabort = () => reject(new DOMException('The upload was aborted.', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });

    xhr.send(form);
  });
}
