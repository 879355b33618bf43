import { errorBodySchema, type ErrorBody } from '@wickstone/contracts';

/** A failed API call, carrying the server's one error shape. */
export class ApiError extends Error {
  readonly status: number;
  readonly body: ErrorBody['error'];

  constructor(status: number, body: ErrorBody['error']) {
    super(body.message);
    this.name = 'ApiError';
    this.status = status;
    this.body = body;
  }
}

export async function apiFetch<T>(path: string, init: RequestInit = {}): Promise<T> {
  const res = await fetch(`/api/v1${path}`, {
    credentials: 'same-origin',
    ...init,
    headers: { Accept: 'application/json', ...(init.body ? { 'Content-Type': 'application/json' } : {}), ...init.headers },
  });
  const text = await res.text();
  const data: unknown = text ? JSON.parse(text) : null;
  if (!res.ok) {
    const parsed = errorBodySchema.safeParse(data);
    throw new ApiError(
      res.status,
      parsed.success ? parsed.data.error : { code: 'internal', message: `HTTP ${res.status}`, details: null },
    );
  }
  return data as T;
}
