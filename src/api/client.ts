/**
 * The one place the studio talks HTTP. Every request is same-origin JSON
 * with the session cookie (`credentials: 'include'`); any non-2xx answer
 * becomes an {@link ApiError} carrying the server's own plain-words message
 * from `{"error":{"code","message"}}`, so screens can show it as is.
 */

/** An error answer from the API. `status` is the HTTP status; `code` the server's error code. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  /** The whole parsed body (for example `latest` on a 409 save conflict). */
  readonly body: unknown;

  constructor(status: number, code: string, message: string, body: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.body = body;
  }
}

/** Fallback wording when the server sends no usable message. */
function describeStatus(status: number): string {
  if (status === 401) return 'Please sign in again; your session has ended.';
  if (status === 403) return 'Your account may not do that on this pattern.';
  if (status === 404) return 'That could not be found. It may have been removed or not shared with you.';
  if (status === 409) return 'Someone saved a newer version in the meantime.';
  if (status === 413) return 'That file or source is too large (the limit is 1 MB).';
  if (status === 429) return 'Too many attempts in a short time. Wait a minute and try again.';
  if (status >= 500) return 'The server ran into a problem. Try again in a moment.';
  return `The request failed (HTTP ${status}).`;
}

async function parseBody(res: Response): Promise<unknown> {
  const text = await res.text();
  if (!text) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return null;
  }
}

/**
 * Send a request to `/api` + `path`. A plain object body is sent as JSON; a
 * FormData body is sent as multipart (the browser sets the boundary).
 * Resolves to the parsed JSON (or `null` for 204); rejects with ApiError,
 * or with an Error in plain words when the server cannot be reached.
 */
export async function apiRequest<T>(
  path: string,
  init: { method?: string; body?: unknown; signal?: AbortSignal } = {},
): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  let body: BodyInit | undefined;
  if (init.body instanceof FormData) body = init.body;
  else if (init.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(init.body);
  }
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      method: init.method ?? (body ? 'POST' : 'GET'),
      headers,
      body,
      credentials: 'include',
      signal: init.signal,
    });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new Error('The Loopwright server cannot be reached. Check that it is running, then try again.');
  }
  const parsed = await parseBody(res);
  if (!res.ok) {
    const error = (parsed as { error?: { code?: unknown; message?: unknown } } | null)?.error;
    const message = typeof error?.message === 'string' && error.message ? error.message : describeStatus(res.status);
    const code = typeof error?.code === 'string' ? error.code : `http_${res.status}`;
    throw new ApiError(res.status, code, message, parsed);
  }
  return parsed as T;
}

/** True when `err` is an ApiError with the given HTTP status. */
export function isApiStatus(err: unknown, status: number): err is ApiError {
  return err instanceof ApiError && err.status === status;
}

/** A message fit to show a person, whatever was thrown. */
export function errorText(err: unknown): string {
  if (err instanceof Error) return err.message;
  return 'Something went wrong. Try again.';
}
