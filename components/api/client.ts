/**
 * The one place that knows how to talk to the API: same-origin base URL, session cookie,
 * the CSRF header on state-changing requests, and turning error bodies into ApiError.
 * Screens never call fetch themselves; they use the hooks in components/queries.
 */
export class ApiError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly fields?: Record<string, string[]>,
    public readonly body?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

let csrfToken: string | null = null;
let csrfPromise: Promise<string> | null = null;

const base = (): string => {
  const g = globalThis as { location?: { origin?: string } };
  return g.location?.origin ?? '';
};

async function fetchCsrf(): Promise<string> {
  csrfPromise ??= fetch(`${base()}/api/auth/csrf`, { credentials: 'include' })
    .then(async (r) => {
      const body = (await r.json().catch(() => ({}))) as { csrfToken?: string };
      csrfToken = body.csrfToken ?? '';
      return csrfToken;
    })
    .finally(() => {
      csrfPromise = null;
    });
  return csrfPromise;
}

/** Forget the CSRF token (after sign-in/sign-out the session changes). */
export function resetCsrf(): void {
  csrfToken = null;
}

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export async function apiRequest<T>(method: Method, path: string, body?: unknown, opts: { form?: FormData; retried?: boolean } = {}): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json' };
  if (method !== 'GET') headers['x-csrf-token'] = csrfToken ?? (await fetchCsrf());
  let payload: BodyInit | undefined;
  if (opts.form) payload = opts.form;
  else if (body !== undefined) {
    headers['content-type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  let res: Response;
  try {
    res = await fetch(`${base()}/api${path}`, { method, headers, body: payload, credentials: 'include' });
  } catch {
    throw new ApiError(0, 'Spinyard cannot be reached. Check your connection and try again.');
  }
  if (res.status === 403 && method !== 'GET' && !opts.retried) {
    const peek = (await res.clone().json().catch(() => ({}))) as { code?: string };
    if (peek.code === 'csrf') {
      resetCsrf();
      return apiRequest<T>(method, path, body, { ...opts, retried: true });
    }
  }
  if (res.status === 204) return undefined as T;
  const type = res.headers.get('content-type') ?? '';
  const data = type.includes('application/json') ? await res.json().catch(() => ({})) : await res.text();
  if (!res.ok) {
    const b = (typeof data === 'object' && data ? data : {}) as { error?: string; fields?: Record<string, string[]> };
    throw new ApiError(res.status, b.error ?? `Request failed (${res.status}).`, b.fields, b as Record<string, unknown>);
  }
  return data as T;
}

export const api = {
  get: <T>(path: string) => apiRequest<T>('GET', path),
  post: <T>(path: string, body?: unknown) => apiRequest<T>('POST', path, body ?? {}),
  put: <T>(path: string, body?: unknown) => apiRequest<T>('PUT', path, body ?? {}),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>('PATCH', path, body ?? {}),
  delete: <T>(path: string, body?: unknown) => apiRequest<T>('DELETE', path, body),
  upload: <T>(path: string, form: FormData) => apiRequest<T>('POST', path, undefined, { form }),
};

/**
 * A Server-Sent Events stream from the API (same origin, so the session cookie goes along), or
 * null where the platform has no EventSource (callers then poll).
 */
export function openEventStream(path: string): EventSource | null {
  const Source = (globalThis as { EventSource?: typeof EventSource }).EventSource;
  return Source ? new Source(`${base()}/api${path}`, { withCredentials: true }) : null;
}
