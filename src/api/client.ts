import type { ApiErrorBody } from '@shared/schemas/common';

/** The one error type every failed request becomes, including a server that cannot be reached. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export function isApiError(e: unknown): e is ApiError {
  return e instanceof ApiError;
}

type Query = Record<string, string | number | boolean | undefined | null>;

export interface RequestOptions {
  query?: Query;
  body?: unknown;
  /** For the session check: a 401 here means "not signed in", not "signed out underneath us". */
  allowUnauthorized?: boolean;
}

let onUnauthorized: () => void = () => {};

/** The one place a lapsed session is handled; main.ts wires it to the sign-in page. */
export function setUnauthorizedHandler(handler: () => void): void {
  onUnauthorized = handler;
}

function urlFor(path: string, query?: Query): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  const qs = params.toString();
  return `/api${path}${qs ? `?${qs}` : ''}`;
}

async function errorFrom(res: Response): Promise<ApiError> {
  const body = (await res.json().catch(() => null)) as ApiErrorBody | null;
  if (body?.error) return new ApiError(res.status, body.error.code, body.error.message, body.error.fields ?? {});
  return new ApiError(res.status, 'http_error', `The server answered ${res.status} ${res.statusText}.`.trim());
}

export async function request<T>(method: string, path: string, opts: RequestOptions = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  // A multipart form (an upload) sets its own Content-Type with the boundary.
  const form = opts.body instanceof FormData;
  if (opts.body !== undefined && !form) headers['Content-Type'] = 'application/json';
  let res: Response;
  try {
    res = await fetch(urlFor(path, opts.query), {
      method,
      headers,
      credentials: 'same-origin',
      body: opts.body === undefined ? undefined : form ? (opts.body as FormData) : JSON.stringify(opts.body),
    });
  } catch {
    throw new ApiError(0, 'network', 'The server could not be reached. Check the connection and try again.');
  }
  if (!res.ok) {
    const error = await errorFrom(res);
    // Only the generic "sign in first" answer means the session is gone; bad credentials are 401s too.
    if (error.status === 401 && error.code === 'unauthorized' && !opts.allowUnauthorized) onUnauthorized();
    throw error;
  }
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

export const api = {
  get: <T>(path: string, query?: Query, opts?: RequestOptions) => request<T>('GET', path, { ...opts, query }),
  post: <T>(path: string, body?: unknown) => request<T>('POST', path, { body: body ?? {} }),
  postForm: <T>(path: string, form: FormData) => request<T>('POST', path, { body: form }),
  put: <T>(path: string, body: unknown) => request<T>('PUT', path, { body }),
  patch: <T>(path: string, body: unknown) => request<T>('PATCH', path, { body }),
  delete: <T>(path: string) => request<T>('DELETE', path),
};
