import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { can, permissions, roles, type Role } from '@wickstone/contracts';
import { routeTable } from '../app.js';
import { TestClient, createTestApp } from '../../testing/client.js';
import { seedOrgWithTeam, type FixtureOrg } from '../../testing/fixtures.js';
import { probeUrl, routeKey } from '../../testing/routes.js';
import type { RouteRecord } from './routes.js';

/*
 * The permission matrix, generated: every route the app declared × every role and the signed-out
 * caller, with the expected answer worked out from the route's declared access and the one
 * permission table in @wickstone/contracts. A probe carries an empty body and ids that exist
 * nowhere, so a caller who gets past the access checks meets validation (400) or "not found" (404),
 * or a harmless success, and nothing of the fixture changes.
 */
const t = await createTestApp();
const routes = routeTable(t.app);
type Caller = Role | 'signed out';
const callers: Caller[] = [...roles, 'signed out'];

/** 401 or 403 when the caller may not, otherwise 'allowed'. */
function expected(route: RouteRecord, caller: Caller): 401 | 403 | 'allowed' {
  if (route.access === 'public') return 'allowed';
  if (caller === 'signed out') return 401;
  if (route.access === 'signedIn') return 'allowed';
  return can(caller, route.access) ? 'allowed' : 403;
}

describe('the route table', () => {
  it('declares the access the issue asks for on each of its routes', () => {
    // The specification side of the matrix: who may call what, as issue 4 says. The generated tests
    // below check that the running app enforces what each route declares.
    const issue4: Record<string, RouteRecord['access']> = {
      'GET /api/v1/auth/csrf': 'public',
      'POST /api/v1/auth/signup': 'public',
      'POST /api/v1/auth/login': 'public',
      'POST /api/v1/auth/logout': 'public',
      'GET /api/v1/auth/me': 'signedIn',
      'PATCH /api/v1/auth/me': 'signedIn',
      'POST /api/v1/auth/password/forgot': 'public',
      'POST /api/v1/auth/password/reset': 'public',
      'GET /api/v1/orgs/:orgId': 'org:read',
      'GET /api/v1/orgs/:orgId/members': 'members:read',
      'PATCH /api/v1/orgs/:orgId/members/:userId': 'members:manage',
      'DELETE /api/v1/orgs/:orgId/members/:userId': 'members:manage',
      'POST /api/v1/orgs/:orgId/invitations': 'members:manage',
      'POST /api/v1/orgs/:orgId/invitations/:invitationId/resend': 'members:manage',
      'DELETE /api/v1/orgs/:orgId/invitations/:invitationId': 'members:manage',
      'GET /api/v1/invitations/:token': 'public',
      'POST /api/v1/invitations/:token/accept': 'public',
      'GET /api/v1/orgs/:orgId/audit': 'audit:read',
      'GET /api/v1/dev/mail': 'public',
      // issue 5: owners and admins edit widgets and upload logos, every member reads them
      'GET /api/v1/orgs/:orgId/widgets': 'widgets:read',
      'POST /api/v1/orgs/:orgId/widgets': 'widgets:write',
      'GET /api/v1/orgs/:orgId/widgets/:widgetId': 'widgets:read',
      'PATCH /api/v1/orgs/:orgId/widgets/:widgetId': 'widgets:write',
      'GET /api/v1/orgs/:orgId/widgets/:widgetId/revisions': 'widgets:read',
      'POST /api/v1/orgs/:orgId/widgets/:widgetId/revisions/:revisionId/restore': 'widgets:write',
      'POST /api/v1/orgs/:orgId/assets': 'assets:write',
      // issue 6: every member reads usage; owners, admins and analysts work leads; owners and admins set retention
      'GET /api/v1/orgs/:orgId/runs': 'usage:read',
      'GET /api/v1/orgs/:orgId/runs/export': 'usage:read',
      'GET /api/v1/orgs/:orgId/runs/:runId': 'usage:read',
      // issue 12: analysts download a run's calculation sheet; anyone verifies a run by its id
      'GET /api/v1/orgs/:orgId/runs/:runId/sheet': 'usage:read',
      'GET /api/v1/verify/:runId': 'public',
      'GET /api/v1/orgs/:orgId/usage/summary': 'usage:read',
      'GET /api/v1/orgs/:orgId/leads': 'leads:read',
      'GET /api/v1/orgs/:orgId/leads/export': 'leads:read',
      'GET /api/v1/orgs/:orgId/leads/:leadId': 'leads:read',
      'PATCH /api/v1/orgs/:orgId/leads/:leadId': 'leads:write',
      'POST /api/v1/orgs/:orgId/leads/:leadId/notes': 'leads:write',
      'DELETE /api/v1/orgs/:orgId/leads/:leadId/personal-data': 'leads:erase',
      'GET /api/v1/orgs/:orgId/settings/retention': 'org:read',
      'PATCH /api/v1/orgs/:orgId/settings/retention': 'settings:write',
      // issue 18: every member sees the plan and use against it; only the owner pays and changes it
      'GET /api/v1/orgs/:orgId/plan': 'org:read',
      'GET /api/v1/orgs/:orgId/billing/invoices': 'billing:manage',
      'POST /api/v1/orgs/:orgId/billing/checkout': 'billing:manage',
      'POST /api/v1/orgs/:orgId/billing/plan': 'billing:manage',
      'POST /api/v1/orgs/:orgId/billing/cancel': 'billing:manage',
      'POST /api/v1/orgs/:orgId/billing/resume': 'billing:manage',
      // issue 15: every member reads the releases; the developer (and owner, admin) pins them
      'GET /api/v1/releases': 'signedIn',
      'PUT /api/v1/orgs/:orgId/widgets/:widgetId/release': 'releases:pin',
      'GET /api/v1/orgs/:orgId/widgets/:widgetId/upgrade-preview': 'releases:pin',
      'PUT /api/v1/orgs/:orgId/widgets/:widgetId/origins': 'embed:manage',
      'GET /api/v1/orgs/:orgId/widgets/:widgetId/refused-origins': 'embed:manage',
      'GET /api/v1/orgs/:orgId/refused-origins': 'embed:manage',
      'POST /api/v1/orgs/:orgId/widgets/:widgetId/key-rotations': 'embed:manage',
      'POST /api/v1/orgs/:orgId/widgets/:widgetId/key-rotations/end-overlap': 'embed:manage',
    };
    const declared = Object.fromEntries(routes.map((r) => [routeKey(r), r.access]));
    for (const [key, access] of Object.entries(issue4)) expect(declared[key], key).toBe(access);
    for (const r of routes) {
      expect(r.access === 'public' || r.access === 'signedIn' || r.access in permissions, routeKey(r)).toBe(
        true,
      );
      expect(r.csrf, routeKey(r)).toBe(r.method !== 'get' && r.csrfExempt === undefined);
    }
  });

  it('refuses to declare an organisation route without a permission, or a permission outside one', async () => {
    const { ApiRoutes } = await import('./routes.js');
    const { createCsrf } = await import('./csrf.js');
    const r = new ApiRoutes('/api/v1', createCsrf(t.db.config));
    expect(() =>
      r.get('/orgs/:orgId/things', { access: 'signedIn', params: undefined }, () => undefined),
    ).toThrow(/permission/);
    expect(() => r.get('/things', { access: 'members:read' }, () => undefined)).toThrow(/permission/);
    // @ts-expect-error: the types allow csrfExempt on public routes only; so does the check at run time.
    expect(() => r.post('/mine', { access: 'signedIn', csrfExempt: 'no' }, () => undefined)).toThrow(
      /CSRF-exempt/,
    );
  });

  it("runs a CSRF-exempt public route without the token and without the caller's session", async () => {
    const express = (await import('express')).default;
    const cookieParser = (await import('cookie-parser')).default;
    const { ApiRoutes } = await import('./routes.js');
    const { createCsrf } = await import('./csrf.js');
    const { createSessions } = await import('./session.js');
    const { createLogger } = await import('../logger.js');
    const r = new ApiRoutes('/api/v1', createCsrf(t.db.config));
    r.post(
      '/embed/ping',
      { access: 'public', csrfExempt: 'called from other sites, without cookies' },
      ({ session }) => ({
        body: { sawSession: session !== null },
      }),
    );
    expect(r.records[0]).toMatchObject({
      csrf: false,
      csrfExempt: 'called from other sites, without cookies',
    });
    const mini = express();
    mini.use(
      '/api/v1',
      express.json(),
      cookieParser(),
      createSessions(t.db.config, createLogger(t.db.config)).load,
      r.router,
    );
    const org = await seedOrgWithTeam();
    const login = await new TestClient(t.app).login(org.users.owner.email, org.users.owner.password);
    const cookie = /wst_session=[^;]+/.exec(String(login.headers['set-cookie']))?.[0] ?? '';
    const { default: request } = await import('supertest');
    const res = await request(mini).post('/api/v1/embed/ping').set('Cookie', cookie).send({});
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ sawSession: false });
  });
});

describe.each(routes.map((r) => [routeKey(r), r] as const))('%s', (_key, route) => {
  let org: FixtureOrg;
  beforeAll(async () => {
    org = await seedOrgWithTeam();
  });

  it.each(callers)('as %s', async (caller) => {
    const client = new TestClient(t.app);
    if (caller !== 'signed out') await client.login(org.users[caller].email, org.users[caller].password);
    const url = probeUrl(route, { orgId: org.id }).replace(/^\/api\/v1/, '');
    const res = await client.send(
      route.method,
      url,
      route.method === 'get' || route.method === 'delete' ? undefined : {},
    );
    const want = expected(route, caller);
    const said = `${routeKey(route)} as ${caller}: ${res.status} ${res.text.slice(0, 300)}`;
    if (want === 'allowed') {
      expect([401, 403], said).not.toContain(res.status);
      expect(res.status, said).toBeLessThan(500);
      // A 404 must come from the handler, not from a route that is declared but not served.
      expect(String(res.body?.error?.message ?? ''), said).not.toMatch(/^No route for/);
    } else {
      expect(res.status, said).toBe(want);
      expect(res.body.error.code, said).toBe(want === 401 ? 'unauthenticated' : 'forbidden');
    }
  });
});

afterAll(async () => {
  await t.close();
});
