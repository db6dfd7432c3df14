import type { ApiErrorBody } from '@shared/schemas/common';
import { noteServerDate } from './server-clock';

/** An answer from the API that was not a success, or no answer at all (status 0). */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string> | undefined;

  constructor(status: number, code: string, message: string, fields?: Record<string, string>) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

let onUnauthorized: (() => void) | null = null;

/**
 * Called whenever a request that needs a session gets 401: the session ended (expired,
 * signed out in another tab), so the app forgets the user and the route guard sends
 * them to sign in.
 */
export function setUnauthorizedHandler(handler: (() => void) | null): void {
  onUnauthorized = handler;
}

type RequestOptions = {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** Extra request headers (the offline queue's Idempotency-Key). */
  headers?: Record<string, string>;
  /** Sign-in and /api/me answer 401 as a normal outcome, not as "your session ended". */
  expectUnauthorized?: boolean;
};

const fallbackMessages: Record<number, string> = {
  400: 'Some of what was sent is not valid.',
  401: 'Please sign in.',
  403: 'Your role on this build does not allow that.',
  404: 'Not found.',
  409: 'That conflicts with the current state. Reload and try again.',
  429: 'Too many attempts. Wait a moment and try again.',
};

/**
 * The API's error shape (apiErrorSchema in shared/schemas/common), checked by hand:
 * every page reads errors, and zod would otherwise load with every page.
 */
function isApiErrorBody(body: unknown): body is ApiErrorBody {
  const error = (body as { error?: unknown } | null)?.error as Record<string, unknown> | undefined;
  if (!error || typeof error !== 'object') return false;
  if (typeof error.code !== 'string' || typeof error.message !== 'string') return false;
  const fields = error.fields;
  if (fields === undefined) return true;
  return (
    typeof fields === 'object' &&
    fields !== null &&
    Object.values(fields).every((v) => typeof v === 'string')
  );
}

async function readError(response: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await response.json();
  } catch {
    // A proxy or a crash page: not our JSON. Fall through to a generic message.
  }
  if (isApiErrorBody(body)) {
    const { code, message, fields } = body.error;
    return new ApiError(response.status, code, message, fields);
  }
  const message =
    fallbackMessages[response.status] ??
    (response.status >= 500
      ? 'Something went wrong on our side. Try again in a moment.'
      : `Request failed (${response.status}).`);
  return new ApiError(response.status, `http_${response.status}`, message);
}

/** The one place the client talks HTTP. JSON in, JSON out, the session rides in the cookie. */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = 'GET', body, signal, expectUnauthorized = false } = options;
  const headers: Record<string, string> = { Accept: 'application/json', ...options.headers };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(
      0,
      'network',
      'Could not reach Headroom. Check your connection and try again.',
    );
  }

  noteServerDate(response.headers.get('Date'));
  if (!response.ok) {
    const error = await readError(response);
    if (response.status === 401 && !expectUnauthorized) onUnauthorized?.();
    throw error;
  }
  if (response.status === 204) return undefined as T;
  const text = await response.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'GET' }),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'POST', body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  delete: <T = void>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'DELETE' }),
};
