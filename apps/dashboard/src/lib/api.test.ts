import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { apiFetch, ApiError, refreshCsrf } from './api';

interface Seen {
  method: string;
  url: string;
  token: string | null;
  contentType: string | null;
  body: unknown;
}

const json = (status: number, body: unknown, headers: Record<string, string> = {}) =>
  new Response(body === null ? null : JSON.stringify(body), {
    status,
    headers: { 'content-type': 'application/json', ...headers },
  });

/** A stand-in server: hands out numbered CSRF tokens and accepts only the newest one. */
function fakeServer(opts: { refuseFirst?: boolean } = {}) {
  const seen: Seen[] = [];
  let issued = 0;
  let refusals = opts.refuseFirst ? 1 : 0;
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = String(input);
    const headers = new Headers(init.headers);
    const method = init.method ?? 'GET';
    seen.push({
      method,
      url,
      token: headers.get('x-csrf-token'),
      contentType: headers.get('content-type'),
      body: init.body instanceof FormData ? init.body : init.body ? JSON.parse(String(init.body)) : undefined,
    });
    if (url.endsWith('/auth/csrf')) return json(200, { csrfToken: `token-${++issued}` });
    if (method !== 'GET') {
      if (refusals > 0 || headers.get('x-csrf-token') !== `token-${issued}`) {
        refusals = Math.max(0, refusals - 1);
        return json(403, {
          error: { code: 'csrf_failed', message: 'Missing or invalid CSRF token', details: null },
        });
      }
    }
    if (url.endsWith('/invalid')) {
      return json(400, {
        error: {
          code: 'validation_failed',
          message: 'Invalid request',
          details: { fields: [{ field: 'body.email', message: 'Taken' }] },
        },
      });
    }
    if (url.endsWith('/limited')) {
      return json(
        429,
        { error: { code: 'rate_limited', message: 'Too many attempts', details: null } },
        { 'retry-after': '120' },
      );
    }
    return method === 'DELETE' ? new Response(null, { status: 204 }) : json(200, { ok: true });
  });
  return { fetchMock, seen };
}

describe('apiFetch', () => {
  let server: ReturnType<typeof fakeServer>;
  beforeEach(() => {
    server = fakeServer();
    vi.stubGlobal('fetch', server.fetchMock);
  });
  afterEach(() => vi.unstubAllGlobals());

  it('sends no CSRF token on a GET and the current one on every state-changing method', async () => {
    await refreshCsrf();
    await apiFetch('/things');
    await apiFetch('/things', { method: 'POST', json: { a: 1 } });
    await apiFetch('/things/1', { method: 'PATCH', json: { a: 2 } });
    await apiFetch('/things/1', { method: 'DELETE' });
    const calls = server.seen.filter((c) => !c.url.endsWith('/auth/csrf'));
    expect(calls.map((c) => [c.method, c.token])).toEqual([
      ['GET', null],
      ['POST', 'token-1'],
      ['PATCH', 'token-1'],
      ['DELETE', 'token-1'],
    ]);
    expect(calls[1]?.body).toEqual({ a: 1 });
  });

  it('fetches a fresh token once and retries when the server answers csrf_failed', async () => {
    server = fakeServer({ refuseFirst: true });
    vi.stubGlobal('fetch', server.fetchMock);
    await refreshCsrf();
    await expect(apiFetch('/things', { method: 'POST', json: {} })).resolves.toEqual({ ok: true });
    expect(server.seen.map((c) => `${c.method} ${c.url.replace('/api/v1', '')} ${c.token ?? '-'}`)).toEqual([
      'GET /auth/csrf -',
      'POST /things token-1',
      'GET /auth/csrf -',
      'POST /things token-2',
    ]);
  });

  it('sends a FormData upload with the token, no JSON type, and the same form on the retry', async () => {
    server = fakeServer({ refuseFirst: true });
    vi.stubGlobal('fetch', server.fetchMock);
    await refreshCsrf();
    const form = new FormData();
    form.append('file', new Blob(['png bytes'], { type: 'image/png' }), 'logo.png');
    await expect(apiFetch('/orgs/1/assets', { method: 'POST', form })).resolves.toEqual({ ok: true });
    const posts = server.seen.filter((c) => c.method === 'POST');
    expect(posts.map((c) => c.token)).toEqual(['token-1', 'token-2']);
    expect(posts.every((c) => c.body === form && c.contentType === null)).toBe(true);
    expect((form.get('file') as File).name).toBe('logo.png');
  });

  it('gives up after one retry, with the server error', async () => {
    const refusing = vi.fn(async (input: RequestInfo | URL) =>
      String(input).endsWith('/auth/csrf')
        ? json(200, { csrfToken: 'never-good' })
        : json(403, {
            error: { code: 'csrf_failed', message: 'Missing or invalid CSRF token', details: null },
          }),
    );
    vi.stubGlobal('fetch', refusing);
    await refreshCsrf();
    const error = await apiFetch('/things', { method: 'POST', json: {} }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).body.code).toBe('csrf_failed');
    expect(refusing.mock.calls.filter(([u]) => !String(u).endsWith('/auth/csrf'))).toHaveLength(2);
  });

  it('uses a rotated token after refreshCsrf', async () => {
    await refreshCsrf();
    await refreshCsrf();
    await apiFetch('/things', { method: 'POST', json: {} });
    expect(server.seen.at(-1)?.token).toBe('token-2');
  });

  it('exposes field problems and the retry delay of an error', async () => {
    await refreshCsrf();
    const invalid = (await apiFetch('/invalid', { method: 'POST', json: {} }).catch(
      (e: unknown) => e,
    )) as ApiError;
    expect(invalid.status).toBe(400);
    expect(invalid.fields).toEqual([{ field: 'body.email', message: 'Taken' }]);
    const limited = (await apiFetch('/limited').catch((e: unknown) => e)) as ApiError;
    expect(limited.status).toBe(429);
    expect(limited.retryAfterS).toBe(120);
    expect(limited.fields).toEqual([]);
  });

  it('turns a network failure into an ApiError with status 0', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const error = (await apiFetch('/things').catch((e: unknown) => e)) as ApiError;
    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(0);
  });
});
