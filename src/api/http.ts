/**
 * The one place the client talks HTTP: JSON in and out, the session cookie sent
 * same-origin, and every failure turned into an {@link ApiError}.
 */

/** A failed API call: the server's `{ error: { code, message, details? } }`, or a network failure (status 0). */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export type HttpMethod = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

type UnauthorizedHandler = (path: string) => void;
let onUnauthorized: UnauthorizedHandler | null = null;

/** Called when any call other than sign-in or "who am I" answers 401 (the session has ended). */
export function setUnauthorizedHandler(handler: UnauthorizedHandler | null): void {
  onUnauthorized = handler;
}

/** Builds an ApiError from a status and whatever body came back (parsed JSON or null). */
export function toApiError(status: number, body: unknown): ApiError {
  if (body && typeof body === 'object' && 'error' in body) {
    const e = (body as { error: unknown }).error;
    if (e && typeof e === 'object') {
      const { code, message, details } = e as { code?: unknown; message?: unknown; details?: unknown };
      if (typeof code === 'string' && typeof message === 'string') return new ApiError(status, code, message, details);
    }
  }
  return new ApiError(status, `http_${status}`, `The server answered with status ${status}.`);
}

const SESSION_PATHS = ['/api/auth/login', '/api/auth/me'];

/** Sends one request to the API and returns the parsed JSON body (undefined for 204). */
export async function request<T>(method: HttpMethod, path: string, body?: unknown): Promise<T> {
  const init: RequestInit = { method, credentials: 'same-origin', headers: { Accept: 'application/json' } };
  if (typeof FormData !== 'undefined' && body instanceof FormData) {
    init.body = body; // multipart: the browser sets the Content-Type with its boundary
  } else if (body !== undefined) {
    init.headers = { ...init.headers, 'Content-Type': 'application/json' };
    init.body = JSON.stringify(body);
  }
  let res: Response;
  try {
    res = await fetch(path, init);
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the server. Check your connection and try again.');
  }
  const text = res.status === 204 ? '' : await res.text();
  let parsed: unknown = null;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = null;
    }
  }
  if (!res.ok) {
    if (res.status === 401 && !SESSION_PATHS.includes(path) && onUnauthorized) onUnauthorized(path);
    throw toApiError(res.status, parsed);
  }
  return (text ? parsed : undefined) as T;
}

export const http = {
  get: <T>(path: string) => request<T>('GET', path),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, body ?? {}),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, body),
  delete: <T = void>(path: string) => request<T>('DELETE', path),
};
