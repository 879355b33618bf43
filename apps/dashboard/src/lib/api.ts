import {
  csrfResponseSchema,
  errorBodySchema,
  fieldIssueSchema,
  type ErrorBody,
  type FieldIssue,
} from '@wickstone/contracts';

/** A failed API call, carrying the server's one error shape. */
export class ApiError extends Error {
  readonly status: number;
  readonly body: ErrorBody['error'];
  /** Seconds until a rate-limited request may be tried again, when the server said. */
  readonly retryAfterS: number | null;

  constructor(status: number, body: ErrorBody['error'], retryAfterS: number | null = null) {
    super(body.message);
    this.name = 'ApiError';
    this.status = status;
    this.body = body;
    this.retryAfterS = retryAfterS;
  }

  /** The per-field problems of a 400, e.g. `{ field: 'body.email', message }`. */
  get fields(): FieldIssue[] {
    const details = this.body.details;
    if (typeof details !== 'object' || details === null || !('fields' in details)) return [];
    const parsed = fieldIssues.safeParse(details.fields);
    return parsed.success ? parsed.data : [];
  }
}

const fieldIssues = fieldIssueSchema.array();

export function isApiError(
  error: unknown,
  status?: number,
  code?: ErrorBody['error']['code'],
): error is ApiError {
  return (
    error instanceof ApiError &&
    (status === undefined || error.status === status) &&
    (code === undefined || error.body.code === code)
  );
}

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/*
 * The CSRF token lives here, not in a query: it is plumbing every state-changing request needs,
 * and one in-flight fetch is shared so a burst of mutations asks the server once.
 */
let csrfToken: string | null = null;
let csrfPending: Promise<string> | null = null;

async function fetchCsrfToken(): Promise<string> {
  const res = await fetch('/api/v1/auth/csrf', {
    credentials: 'same-origin',
    headers: { Accept: 'application/json' },
  });
  const data = await readJson(res);
  if (!res.ok) throw toApiError(res, data);
  const parsed = csrfResponseSchema.safeParse(data);
  if (!parsed.success)
    throw new ApiError(res.status, {
      code: 'internal',
      message: 'The server sent no CSRF token',
      details: null,
    });
  return parsed.data.csrfToken;
}

function csrf(): Promise<string> {
  if (csrfToken) return Promise.resolve(csrfToken);
  csrfPending ??= fetchCsrfToken()
    .then((token) => {
      csrfToken = token;
      return token;
    })
    .finally(() => {
      csrfPending = null;
    });
  return csrfPending;
}

/**
 * Forget the token and fetch a fresh one. Called after sign-in, sign-up, accepting an invitation,
 * changing the password and sign-out, because the server may rotate it when the session changes.
 */
export async function refreshCsrf(): Promise<void> {
  csrfToken = null;
  try {
    await csrf();
  } catch {
    // A failed refresh is retried lazily by the next state-changing request.
  }
}

async function readJson(res: Response): Promise<unknown> {
  const text = await res.text();
  if (!text) return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return null;
  }
}

/** `Retry-After` in seconds, or the `reset` of the standard `RateLimit` header. */
function retryAfter(res: Response): number | null {
  const header = res.headers.get('retry-after');
  if (header && /^\d+$/.test(header)) return Number(header);
  const reset = /(?:^|[;,\s])(?:t|reset)=(\d+)/.exec(res.headers.get('ratelimit') ?? '');
  if (reset?.[1]) return Number(reset[1]);
  const legacy = res.headers.get('ratelimit-reset');
  return legacy && /^\d+$/.test(legacy) ? Number(legacy) : null;
}

function toApiError(res: Response, data: unknown): ApiError {
  const parsed = errorBodySchema.safeParse(data);
  return new ApiError(
    res.status,
    parsed.success
      ? parsed.data.error
      : {
          code: res.status >= 500 ? 'internal' : 'bad_request',
          message: `The server answered HTTP ${res.status}`,
          details: null,
        },
    retryAfter(res),
  );
}

export interface ApiInit extends Omit<RequestInit, 'body'> {
  /** A JSON body: serialised here, so callers pass the zod-parsed object. */
  json?: unknown;
  /**
   * A multipart body (a file upload). The browser writes its Content-Type with the boundary, so
   * none is set here; the same FormData is sent again on the one CSRF retry.
   */
  form?: FormData;
}

async function send(path: string, init: ApiInit, token: string | null): Promise<Response> {
  const { json, form, headers, ...rest } = init;
  try {
    return await fetch(`/api/v1${path}`, {
      credentials: 'same-origin',
      ...rest,
      headers: {
        Accept: 'application/json',
        ...(json !== undefined ? { 'Content-Type': 'application/json' } : {}),
        ...(token ? { 'x-csrf-token': token } : {}),
        ...headers,
      },
      body: json !== undefined ? JSON.stringify(json) : form,
    });
  } catch {
    throw new ApiError(0, {
      code: 'service_unavailable',
      message: 'The server cannot be reached',
      details: null,
    });
  }
}

/** Call the API; state-changing methods carry the CSRF token and re-fetch it once if it was refused. */
export async function apiFetch<T>(path: string, init: ApiInit = {}): Promise<T> {
  const method = (init.method ?? 'GET').toUpperCase();
  const needsToken = stateChanging.has(method);
  let res = await send(path, init, needsToken ? await csrf() : null);
  let data = await readJson(res);
  if (
    needsToken &&
    res.status === 403 &&
    errorBodySchema.safeParse(data).data?.error.code === 'csrf_failed'
  ) {
    // The token expired or rotated under us (e.g. the session was renewed): one fresh try.
    csrfToken = null;
    res = await send(path, init, await csrf());
    data = await readJson(res);
  }
  if (!res.ok) throw toApiError(res, data);
  return data as T;
}
