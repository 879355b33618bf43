import { expect } from 'vitest';

/** A signed-in API session over plain fetch: the session cookie and the CSRF token it needs. */
export class ApiSession {
  private cookies = new Map<string, string>();
  private token: string | null = null;
  /**
   * `base` is the server's origin; it may change between calls (several server processes behind
   * one "load balancer"). `headers` go with every request (e.g. X-Forwarded-For).
   */
  constructor(
    public base: string,
    private readonly headers: Record<string, string> = {},
  ) {}

  /** A session signed in as this user. */
  static async signedIn(base: string, user: { email: string; password: string }): Promise<ApiSession> {
    const session = new ApiSession(base);
    await session.json('POST', '/auth/login', { email: user.email, password: user.password }, 200);
    return session;
  }

  private keep(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
      if (pair!.startsWith('wst_session=')) this.token = null;
    }
  }

  async call(method: string, path: string, body?: unknown): Promise<Response> {
    if (method !== 'GET' && !this.token) {
      const res = await this.call('GET', '/auth/csrf');
      this.token = ((await res.json()) as { csrfToken: string }).csrfToken;
    }
    const res = await fetch(`${this.base}/api/v1${path}`, {
      method,
      headers: {
        Accept: 'application/json',
        ...this.headers,
        cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
        ...(body !== undefined ? { 'Content-Type': 'application/json' } : {}),
        ...(method !== 'GET' && this.token ? { 'x-csrf-token': this.token } : {}),
      },
      body: body !== undefined ? JSON.stringify(body) : undefined,
    });
    this.keep(res);
    return res;
  }

  async json<T>(method: string, path: string, body: unknown, status: number): Promise<T> {
    const res = await this.call(method, path, body);
    const text = await res.text();
    expect(res.status, `${method} ${path}: ${text}`).toBe(status);
    return JSON.parse(text) as T;
  }
}
