import request from 'supertest';
import type { Express } from 'express';
import { createApp, type AppDeps } from '../src/app.js';
import { createLogger } from '../src/logger.js';
import { createTestDatabase, type TestDatabase } from './db.js';

export const API = '/api/v1';

export interface TestApp {
  app: Express;
  db: TestDatabase;
  close(): Promise<void>;
}

/**
 * The app over a fresh test database. bcrypt runs at cost 4 and the sign-in limits are high unless
 * a test asks otherwise, so tests that sign in often stay fast and are not rate limited by accident.
 */
export async function createTestApp(
  env: NodeJS.ProcessEnv = {},
  deps: Partial<Pick<AppDeps, 'mailer'>> = {},
): Promise<TestApp> {
  const db = await createTestDatabase({
    BCRYPT_COST: '4',
    LOGIN_LIMIT_PER_IP: '100000',
    LOGIN_LIMIT_PER_ACCOUNT: '1000',
    LOGIN_FREE_FAILURES: '1000',
    LOGIN_ACCOUNT_FREE_FAILURES: '1000',
    LOGIN_BURST_NOTIFY: '1000',
    COPY_LIMIT_PER_RECIPIENT: '1000',
    ...env,
  });
  const app = createApp({
    config: db.config,
    sequelize: db.sequelize,
    logger: createLogger(db.config),
    ...deps,
  });
  return { app, db, close: () => db.drop() };
}

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** A response on its way, with `.expect(status)`, which fails showing the body it got instead. */
export type Pending = Promise<request.Response> & { expect(status: number): Promise<request.Response> };

function pending(p: Promise<request.Response>, what: string): Pending {
  return Object.assign(p, {
    expect: async (status: number) => {
      const res = await p;
      if (res.status !== status)
        throw new Error(`expected ${status}, got ${res.status} for ${what}: ${res.text.slice(0, 500)}`);
      return res;
    },
  });
}

/** One browser: a cookie jar, and the CSRF token fetched when needed and sent with every state change. */
export class TestClient {
  readonly agent: ReturnType<typeof request.agent>;
  private csrfToken: string | undefined;

  constructor(readonly app: Express) {
    this.agent = request.agent(app);
  }

  async csrf(): Promise<string> {
    if (!this.csrfToken) {
      const res = await this.agent.get(`${API}/auth/csrf`).expect(200);
      this.csrfToken = (res.body as { csrfToken: string }).csrfToken;
    }
    return this.csrfToken;
  }

  /** A request under /api/v1; state changes carry the CSRF token unless `csrf: false`. */
  send(method: Method, path: string, body?: unknown, opts: { csrf?: boolean } = {}): Pending {
    return pending(
      (async () => {
        const wantsToken = method !== 'get' && opts.csrf !== false;
        const token = wantsToken ? await this.csrf() : undefined;
        let req = this.agent[method](`${API}${path}`);
        if (token) req = req.set('x-csrf-token', token);
        const res = body === undefined ? await req : await req.send(body as object);
        // The session changed (sign-in, sign-out, accepted invitation): its CSRF token is bound to
        // the old one, so fetch a fresh one next time, as the dashboard does.
        const setCookie = res.headers['set-cookie'] as string[] | string | undefined;
        if ([setCookie ?? []].flat().some((c) => /wst_session=/.test(c))) this.csrfToken = undefined;
        return res;
      })(),
      `${method.toUpperCase()} ${path}`,
    );
  }

  get(path: string) {
    return this.send('get', path);
  }
  post(path: string, body?: unknown) {
    return this.send('post', path, body);
  }
  put(path: string, body?: unknown) {
    return this.send('put', path, body);
  }
  patch(path: string, body?: unknown) {
    return this.send('patch', path, body);
  }
  delete(path: string) {
    return this.send('delete', path);
  }

  async login(email: string, password: string): Promise<request.Response> {
    const res = await this.post('/auth/login', { email, password });
    if (res.status !== 200)
      throw new Error(`login of ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res;
  }
}

export interface KeptMessage {
  id: string;
  /** The sender as the header says it (`"Name" <address>`). */
  from: string;
  /** The Reply-To header as text ('' when there is none). */
  replyTo?: string;
  to: string[];
  subject: string;
  text: string;
  html?: string;
  links: string[];
  attachments?: { filename: string; contentType: string; size: number; contentBase64: string }[];
}

/**
 * The fake SMTP server's messages to one address, newest first, waiting up to `timeoutMs` for at
 * least `atLeast` of them (some mail is sent after the answer).
 */
export async function mailbox(
  fakeApiUrl: string | undefined,
  to: string,
  atLeast = 1,
  timeoutMs = 5_000,
): Promise<KeptMessage[]> {
  if (!fakeApiUrl) throw new Error('FAKE_MAIL_API_URL is not set: source the test environment');
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await fetch(`${fakeApiUrl}/messages?to=${encodeURIComponent(to)}`);
    const { items } = (await res.json()) as { items: KeptMessage[] };
    if (items.length >= atLeast || Date.now() > until) return items;
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The path and token of the first link in a message that goes to the dashboard page `page`. */
export function linkToken(message: KeptMessage, page: 'invitations' | 'reset-password'): string {
  for (const link of message.links) {
    const url = new URL(link);
    if (page === 'reset-password' && url.pathname.endsWith('/reset-password'))
      return url.searchParams.get('token') ?? '';
    const m = /\/invitations\/([^/]+)$/.exec(url.pathname);
    if (page === 'invitations' && m?.[1]) return decodeURIComponent(m[1]);
  }
  throw new Error(`no ${page} link in "${message.subject}": ${message.links.join(', ')}`);
}
