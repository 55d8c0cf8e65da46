// One fetch wrapper for every server call: same-origin cookies, the CSRF header on writes,
// and the server's `{ error: { code, message, fields? } }` turned into an ApiError.

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly code: string,
    message: string,
    public readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
let csrfToken: Promise<string> | null = null;

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  if (!res.ok) throw await toApiError(res);
  const body = (await res.json()) as { csrfToken: string };
  return body.csrfToken;
}

/** The token is tied to the session: sign-in hands out a new one, sign-out drops it. */
export function setCsrfToken(token: string | null) {
  csrfToken = token ? Promise.resolve(token) : null;
}

/** The session's CSRF token, fetched once and kept until a sign-in, a sign-out or a refusal drops it. */
export function currentCsrfToken() {
  csrfToken ??= fetchCsrfToken().catch((error) => {
    csrfToken = null;
    throw error;
  });
  return csrfToken;
}

async function toApiError(res: Response): Promise<ApiError> {
  try {
    const body = (await res.json()) as { error?: { code?: string; message?: string; fields?: Record<string, string> } };
    if (body.error?.message) return new ApiError(res.status, body.error.code ?? 'error', body.error.message, body.error.fields ?? {});
  } catch {
    // Not JSON (a proxy page, an empty body): fall through to a plain message.
  }
  return new ApiError(res.status, 'http_error', `The server answered ${res.status} ${res.statusText}; try again in a minute.`);
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  query?: Record<string, string | number | boolean | undefined>;
  signal?: AbortSignal;
}

function urlFor(path: string, query?: RequestOptions['query']) {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) if (value !== undefined) params.set(key, String(value));
  const search = params.toString();
  return search ? `${path}?${search}` : path;
}

async function send(path: string, options: RequestOptions): Promise<Response> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (WRITE_METHODS.has(method)) headers['x-csrf-token'] = await currentCsrfToken();
  try {
    return await fetch(urlFor(path, options.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: options.signal,
    });
  } catch (error) {
    if ((error as Error).name === 'AbortError') throw error;
    throw new ApiError(0, 'network', 'Patchwise cannot be reached; check your connection and try again.');
  }
}

/** Calls the API and returns its JSON (undefined for 204). A stale CSRF token is refreshed and the call retried once. */
export async function api<T>(path: string, options: RequestOptions = {}): Promise<T> {
  let res = await send(path, options);
  if (res.status === 403 && WRITE_METHODS.has(options.method ?? 'GET')) {
    const error = await toApiError(res.clone());
    if (error.code === 'csrf') {
      setCsrfToken(null);
      res = await send(path, options);
    }
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

/** GETs a binary answer (a density grid) as raw bytes; errors come back as JSON like everywhere else. */
export async function apiBytes(path: string, options: Pick<RequestOptions, 'signal'> = {}): Promise<ArrayBuffer> {
  const res = await send(path, { signal: options.signal });
  if (!res.ok) throw await toApiError(res);
  return res.arrayBuffer();
}
