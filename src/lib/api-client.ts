import type { Problem } from '@shared/api';

/**
 * The one way the client talks to the API: same-origin fetch with the session cookie, JSON in
 * and out, and every failure thrown as an {@link ApiError} carrying the RFC 9457 problem.
 */

/** A failed API call. `status` 0 means the server could not be reached at all. */
export class ApiError extends Error {
  readonly status: number;
  readonly problem: Problem;

  constructor(problem: Problem) {
    super(problem.detail ?? problem.title);
    this.name = 'ApiError';
    this.status = problem.status;
    this.problem = problem;
  }

  /** Field messages of a 400, keyed by dotted path (`settings.verificationDistance`). */
  get fieldErrors(): { path: string; message: string }[] {
    return (this.problem.errors ?? []).map((e) => ({ path: normalisePath(e.path), message: e.message }));
  }

  /** True for a 409 on a stale version (someone else saved first): it carries the record as it now stands. */
  get isStale(): boolean {
    return this.status === 409 && this.problem.current !== undefined;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

function normalisePath(path: string): string {
  return path.replace(/^\/+/, '').replace(/\//g, '.').replace(/\[(\d+)\]/g, '.$1');
}

type UnauthorizedHandler = () => void;
let unauthorizedHandler: UnauthorizedHandler | null = null;

/**
 * Called when any request answers 401 (the session ended or expired). The app wiring registers
 * a handler that marks the session signed out; lib code knows nothing of features.
 */
export function onUnauthorized(handler: UnauthorizedHandler): void {
  unauthorizedHandler = handler;
}

type Query = Record<string, string | number | boolean | null | undefined>;

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  query?: Query;
  signal?: AbortSignal;
  /** Skip the signed-out reset on 401 (the sign-in and session calls handle 401 themselves). */
  ignoreUnauthorized?: boolean;
}

function buildUrl(path: string, query?: Query): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const qs = params.toString();
  return qs ? `${path}?${qs}` : path;
}

async function readProblem(response: Response): Promise<Problem> {
  const fallback: Problem = {
    type: 'about:blank',
    title: response.statusText || `Request failed (${response.status})`,
    status: response.status,
  };
  const type = response.headers.get('content-type') ?? '';
  if (!type.includes('json')) return fallback;
  try {
    const body = (await response.json()) as Partial<Problem>;
    return { ...fallback, ...body, status: body.status ?? response.status };
  } catch {
    return fallback;
  }
}

/** Perform one API request; resolves to the parsed JSON body (undefined for 204). */
export async function apiRequest<T>(path: string, options: RequestOptions = {}): Promise<T> {
  const { method = 'GET', body, query, signal, ignoreUnauthorized = false } = options;
  const headers: Record<string, string> = { Accept: 'application/json, application/problem+json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(buildUrl(path, query), {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError({
      type: 'about:blank',
      title: 'Cannot reach the Threadline server',
      status: 0,
      detail: 'Check the connection and try again.',
    });
  }

  if (!response.ok) {
    const problem = await readProblem(response);
    if (response.status === 401 && !ignoreUnauthorized) unauthorizedHandler?.();
    throw new ApiError(problem);
  }
  if (response.status === 204) return undefined as T;
  const type = response.headers.get('content-type') ?? '';
  if (!type.includes('json')) return undefined as T;
  return (await response.json()) as T;
}

/** Short-hands for the verbs. */
export const api = {
  get: <T>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'GET' }),
  post: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'POST', body }),
  put: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PUT', body }),
  patch: <T>(path: string, body?: unknown, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  delete: <T = void>(path: string, options?: Omit<RequestOptions, 'method' | 'body'>) =>
    apiRequest<T>(path, { ...options, method: 'DELETE' }),
};
