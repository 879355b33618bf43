import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SignJWT, base64url, decodeJwt } from 'jose';
import request from 'supertest';
import { routeTable } from '../app.js';
import { createLogger } from '../logger.js';
import { Membership, User } from '../db/models/index.js';
import { TestClient, createTestApp } from '../../testing/client.js';
import { seedOrgWithTeam, snapshotTables, uniqueEmail, type FixtureOrg } from '../../testing/fixtures.js';
import { probeUrl, routeKey } from '../../testing/routes.js';
import { createSessions, deriveKey } from './session.js';

/*
 * Forged sessions answer 401 and a state change without the CSRF token 403, on every route that
 * needs each (generated from the route table).
 */
const t = await createTestApp();
const routes = routeTable(t.app);
const sessions = createSessions(t.db.config, createLogger(t.db.config));
const key = deriveKey(t.db.config.jwtSecret, 'session');
const now = () => Math.floor(Date.now() / 1000);

let org: FixtureOrg;
let realToken: string;
let claims: { sub: string; sid: string; sv: number; auth_time: number };

beforeAll(async () => {
  org = await seedOrgWithTeam();
  const login = await new TestClient(t.app).login(org.users.owner.email, org.users.owner.password);
  const cookie = [login.headers['set-cookie'] ?? []].flat().find((c: string) => c.startsWith('wst_session='));
  realToken = /^wst_session=([^;]+)/.exec(cookie ?? '')?.[1] ?? '';
  claims = decodeJwt(realToken) as typeof claims;
});

const me = (token: string) => request(t.app).get('/api/v1/auth/me').set('Cookie', `wst_session=${token}`);
const sign = (payload: Record<string, unknown>, alg = 'HS256', k: Uint8Array = key) =>
  new SignJWT(payload)
    .setProtectedHeader({ alg, typ: 'JWT' })
    .setIssuer('wickstone')
    .setAudience('wickstone-api')
    .setIssuedAt()
    .sign(k);
const claimsWith = (over: Record<string, unknown> = {}) => ({
  sub: claims.sub,
  sid: claims.sid,
  sv: claims.sv,
  auth_time: claims.auth_time,
  exp: now() + 600,
  ...over,
});

describe('forged sessions', () => {
  it('accepts the genuine cookie (so the refusals below are about the forgery)', async () => {
    expect((await me(realToken)).status).toBe(200);
    expect((await me(await sign(claimsWith()))).status).toBe(200);
  });

  const forgeries: Array<[string, () => Promise<string>]> = [
    [
      'a tampered signature',
      async () => {
        const [h, p, s] = realToken.split('.');
        const sig = base64url.decode(s!);
        sig[5] = (sig[5] ?? 0) ^ 0xff;
        return `${h}.${p}.${base64url.encode(sig)}`;
      },
    ],
    [
      'a tampered payload (another user)',
      async () => {
        const [h, , s] = realToken.split('.');
        const payload = { ...decodeJwt(realToken), sub: String(org.users.admin.id) };
        return `${h}.${base64url.encode(JSON.stringify(payload))}.${s}`;
      },
    ],
    ['an expired token', () => sign(claimsWith({ exp: now() - 60 }))],
    [
      'a session past its longest life',
      () => sign(claimsWith({ auth_time: now() - t.db.config.auth.sessionMaxS - 60 })),
    ],
    [
      'alg: none',
      async () => {
        const h = base64url.encode(JSON.stringify({ alg: 'none', typ: 'JWT' }));
        const p = base64url.encode(
          JSON.stringify({ ...claimsWith(), iss: 'wickstone', aud: 'wickstone-api', iat: now() }),
        );
        return `${h}.${p}.`;
      },
    ],
    ['another algorithm with the right key (HS512)', () => sign(claimsWith(), 'HS512')],
    [
      'the wrong key',
      () =>
        sign(claimsWith(), 'HS256', new TextEncoder().encode('an-attacker-guessed-this-secret-0123456789')),
    ],
    ['an old session version (before a password change)', () => sign(claimsWith({ sv: claims.sv + 1 }))],
    ['a user that does not exist', () => sign(claimsWith({ sub: '4000000000' }))],
    ['garbage', async () => 'not.a.jwt'],
  ];

  it.each(forgeries)('refuses %s with 401 and clears the cookie', async (_what, forge) => {
    const res = await me(await forge());
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
    expect(String(res.headers['set-cookie'])).toMatch(/wst_session=;.*Expires=Thu, 01 Jan 1970/);
  });

  const signedInRoutes = routes.filter((r) => r.access !== 'public');
  it.each(signedInRoutes.map((r) => [routeKey(r), r] as const))(
    '%s: 401 with a forged cookie, even with a valid CSRF token',
    async (_k, route) => {
      const forged = await sign(claimsWith({ exp: now() - 60 }));
      // A signed-out CSRF token, as a browser holding the forged cookie would get from GET /auth/csrf.
      const csrf = await request(t.app)
        .get('/api/v1/auth/csrf')
        .set('Cookie', `wst_session=${forged}`)
        .expect(200);
      const token = csrf.body.csrfToken as string;
      const res = await request(t.app)
        [route.method](probeUrl(route, { orgId: org.id }))
        .set('Cookie', `wst_session=${forged}; wst_csrf=${token}`)
        .set('x-csrf-token', token);
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    },
  );

  it('renews a session once half its life has gone, keeping the same session id', async () => {
    const halfGone = await sign(claimsWith({ exp: now() + 60 }));
    const res = await me(halfGone);
    expect(res.status).toBe(200);
    const renewed = /wst_session=([^;]+)/.exec(String(res.headers['set-cookie']))?.[1] ?? '';
    const c = decodeJwt(renewed);
    expect(c.exp! - now()).toBeGreaterThan(t.db.config.auth.sessionTtlS - 10);
    expect(c.sid).toBe(claims.sid);
    // A fresh one is not re-issued on every request.
    expect(String((await me(realToken)).headers['set-cookie'] ?? '')).not.toMatch(/wst_session=/);
  });

  it('the tokens it signs itself pass (the forgery tests use the same signer)', async () => {
    const token = await sessions.sign({
      userId: Number(claims.sub),
      sid: claims.sid,
      sessionVersion: claims.sv,
      authTime: now(),
      expiresAt: now() + 300,
    });
    expect((await me(token)).status).toBe(200);
  });
});

describe('CSRF', () => {
  let owner: TestClient;
  let ownerSession: string;
  beforeAll(async () => {
    owner = new TestClient(t.app);
    const login = await owner.login(org.users.owner.email, org.users.owner.password);
    ownerSession = /wst_session=[^;]+/.exec(String(login.headers['set-cookie']))?.[0] ?? '';
  });

  const stateChanging = routes.filter((r) => r.csrf);
  it.each(stateChanging.map((r) => [routeKey(r), r] as const))(
    '%s: 403 csrf_failed without the token, nothing changed',
    async (_k, route) => {
      const before = await snapshotTables(t.db.sequelize);
      const url = probeUrl(route, { orgId: org.id, userId: org.users.analyst.id }).replace(/^\/api\/v1/, '');
      const res = await owner.send(route.method, url, route.method === 'delete' ? undefined : {}, {
        csrf: false,
      });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('csrf_failed');
      expect(await snapshotTables(t.db.sequelize)).toEqual(before);
    },
  );

  it("refuses a real change without the token, with a wrong one, and with another browser's", async () => {
    const target = org.users.developer.id;
    const url = `/api/v1/orgs/${org.id}/members/${target}`;
    const other = new TestClient(t.app);
    const othersToken = await other.csrf();
    const mine = await owner.csrf();
    const [nonce] = mine.split('.');
    for (const header of [undefined, 'made-up', `${nonce}.AAAA`, othersToken]) {
      let req = owner.agent.patch(url);
      if (header) req = req.set('x-csrf-token', header);
      const res = await req.send({ role: 'analyst' });
      expect(res.status, String(header)).toBe(403);
      expect(res.body.error.code).toBe('csrf_failed');
    }
    // The header without its cookie is refused too.
    const noCookie = await request(t.app)
      .patch(url)
      .set('Cookie', ownerSession)
      .set('x-csrf-token', mine)
      .send({ role: 'analyst' });
    expect(noCookie.status).toBe(403);
    expect((await Membership.findOne({ where: { organizationId: org.id, userId: target } }))?.role).toBe(
      'developer',
    );
    // And with it, the same change goes through.
    await owner.patch(`/orgs/${org.id}/members/${target}`, { role: 'analyst' }).expect(200);
  });

  it('refuses a sign-up without the token: no account is made', async () => {
    const email = uniqueEmail('csrf');
    const res = await new TestClient(t.app).send(
      'post',
      '/auth/signup',
      { organizationName: 'Forged Ltd', name: 'Eve', email, password: 'csrf-less-signup-1' },
      { csrf: false },
    );
    expect(res.status).toBe(403);
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it('binds the token to the session: the one from before signing in no longer works after', async () => {
    const client = new TestClient(t.app);
    const before = await client.csrf();
    const login = await client.agent
      .post('/api/v1/auth/login')
      .set('x-csrf-token', before)
      .send({ email: org.users.analyst.email, password: org.users.analyst.password });
    expect(login.status).toBe(200);
    const stale = await client.agent
      .patch('/api/v1/auth/me')
      .set('x-csrf-token', before)
      .send({ name: 'Renamed' });
    expect(stale.status).toBe(403);
    const fresh = (await client.agent.get('/api/v1/auth/csrf').expect(200)).body.csrfToken as string;
    expect(fresh).not.toBe(before);
    await client.agent.patch('/api/v1/auth/me').set('x-csrf-token', fresh).send({}).expect(200);
  });
});

afterAll(async () => {
  await t.close();
});
