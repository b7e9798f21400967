// The one way the client talks to the server: JSON in and out, the CSRF token on every
// mutation, and server errors turned into ApiError with the server's message (written for users).

export interface ApiErrorBody {
  code: string;
  message: string;
  field?: string;
  [extra: string]: unknown;
}

export class ApiError extends Error {
  constructor(readonly status: number, readonly body: ApiErrorBody) {
    super(body.message);
  }
  get code(): string {
    return this.body.code;
  }
}

const MUTATING = new Set(['POST', 'PATCH', 'PUT', 'DELETE']);
let csrfToken: Promise<string> | null = null;

/** The session's CSRF token, fetched once and reused until the session changes. */
function csrf(): Promise<string> {
  csrfToken ??= fetch('/api/csrf', { credentials: 'same-origin' })
    .then((r) => r.json() as Promise<{ token: string }>)
    .then((b) => b.token)
    .catch((e: unknown) => {
      csrfToken = null;
      throw e;
    });
  return csrfToken;
}

/** Forget the token (after sign-out, or when the server says it is stale). */
export function resetCsrf(): void {
  csrfToken = null;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  json?: unknown;
  form?: FormData;
  signal?: AbortSignal;
}

async function send(path: string, o: RequestOptions): Promise<Response> {
  const method = o.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (o.json !== undefined) headers['Content-Type'] = 'application/json';
  if (MUTATING.has(method)) headers['X-CSRF-Token'] = await csrf();
  return fetch(path, {
    method,
    headers,
    credentials: 'same-origin',
    body: o.form ?? (o.json !== undefined ? JSON.stringify(o.json) : undefined),
    signal: o.signal,
  });
}

async function errorOf(res: Response): Promise<ApiError> {
  try {
    const body = (await res.json()) as { error?: ApiErrorBody };
    if (body.error?.message) return new ApiError(res.status, body.error);
  } catch {
    /* not JSON: fall through */
  }
  return new ApiError(res.status, { code: 'http_' + res.status, message: `The server answered ${res.status} ${res.statusText}. Try again in a moment.` });
}

/** Calls the API; resolves with the JSON body (undefined for 204), rejects with ApiError. */
export async function api<T>(path: string, o: RequestOptions = {}): Promise<T> {
  let res = await send(path, o);
  if (res.status === 403 && MUTATING.has(o.method ?? 'GET')) {
    const err = await errorOf(res.clone());
    // A stale token (the session was renewed at sign-in): fetch a fresh one and retry once.
    if (err.code === 'csrf_invalid') {
      resetCsrf();
      res = await send(path, o);
    }
  }
  if (!res.ok) throw await errorOf(res);
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

/** True for "nobody is signed in" answers. */
export function isSignedOut(e: unknown): boolean {
  return e instanceof ApiError && e.status === 401;
}

/** A message for any thrown value, for showing to the user. */
export function errorMessage(e: unknown): string {
  if (e instanceof ApiError) return e.message;
  if (e instanceof TypeError) return 'The server could not be reached. Check your connection and try again.';
  return e instanceof Error ? e.message : String(e);
}
