import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { routeTable } from '../app.js';
import { Invitation, User } from '../db/models/index.js';
import { TestClient, createTestApp } from '../../testing/client.js';
import { seedOrgWithTeam, snapshotTables, uniqueEmail, type FixtureOrg } from '../../testing/fixtures.js';
import { probeUrl, routeKey } from '../../testing/routes.js';
import { liveWidget, reportRun, requestAssessment } from '../../testing/usage.js';

/*
 * Two organisations. Everything of one, asked for by the other, answers 404 and changes nothing:
 * generated over every organisation route in the route table, first with the other
 * organisation's id, then with this organisation's id and the other's members and invitations.
 */
const t = await createTestApp();
const orgRoutes = routeTable(t.app).filter((r) => r.path.includes('/orgs/:orgId'));

/** A body that passes validation, for the routes that take one, so a 404 is not a 400 in disguise. */
const validBodies: Record<string, unknown> = {
  'PATCH /api/v1/orgs/:orgId/members/:userId': { role: 'developer' },
  'POST /api/v1/orgs/:orgId/invitations': { email: 'someone-new@tests.example', role: 'analyst' },
  'POST /api/v1/orgs/:orgId/widgets': { name: 'Intruder widget', calculatorId: 'tube-rise' },
  'PATCH /api/v1/orgs/:orgId/widgets/:widgetId': { name: 'Taken over' },
  'PUT /api/v1/orgs/:orgId/widgets/:widgetId/release': { pin: '0.1.0' },
  'PUT /api/v1/orgs/:orgId/widgets/:widgetId/origins': { origins: ['https://intruder.example'] },
  'POST /api/v1/orgs/:orgId/widgets/:widgetId/key-rotations': {
    oldKeyValidUntil: new Date(Date.now() + 7 * 86_400_000).toISOString(),
  },
  'PATCH /api/v1/orgs/:orgId/leads/:leadId': { status: 'closed' },
  'POST /api/v1/orgs/:orgId/leads/:leadId/notes': { body: 'Taken over' },
  'PATCH /api/v1/orgs/:orgId/settings/retention': { months: 1 },
  'POST /api/v1/orgs/:orgId/billing/checkout': { plan: 'field' },
  'POST /api/v1/orgs/:orgId/billing/plan': { plan: 'office' },
};
/** Path parameters naming an object inside an organisation: each is probed with the other organisation's. */
const OBJECT_IDS = /:(userId|invitationId|widgetId|runId|leadId)/;

describe('two organisations', () => {
  let a: FixtureOrg;
  let b: FixtureOrg;
  let aInvitationId: number;
  let aWidgetId: number;
  let aRunId: string;
  let aLeadId: number;
  /** The ids of A's member, invitation, widget, run and lead, for the probes' path parameters. */
  const aObjects = () => ({
    userId: a.users.analyst.id,
    invitationId: aInvitationId,
    widgetId: aWidgetId,
    runId: aRunId,
    leadId: aLeadId,
  });
  let bOwner: TestClient;
  let outsider: TestClient;

  beforeAll(async () => {
    a = await seedOrgWithTeam('Alder Carr Ground');
    b = await seedOrgWithTeam('Birch Moss Damp');
    const aOwner = new TestClient(t.app);
    await aOwner.login(a.users.owner.email, a.users.owner.password);
    aInvitationId = (
      await aOwner
        .post(`/orgs/${a.id}/invitations`, { email: uniqueEmail('pending'), role: 'analyst' })
        .expect(201)
    ).body.id;
    aWidgetId = (
      await aOwner
        .post(`/orgs/${a.id}/widgets`, { name: 'Alder tube rise', calculatorId: 'tube-rise' })
        .expect(201)
    ).body.id;
    // A run of A's, reported through the embed API, with a request for an assessment.
    const aLive = await liveWidget(aOwner, a.id, 'Alder live tube', 'tube-rise');
    aRunId = await reportRun(t.app, aLive, { diameter: 0.0008 });
    aLeadId = await requestAssessment(t.app, aLive, aRunId, {
      name: 'Hester Quayle',
      email: 'hester.quayle@mail.example',
    });
    bOwner = new TestClient(t.app);
    await bOwner.login(b.users.owner.email, b.users.owner.password);
    // Someone with an account and no organisation at all.
    outsider = new TestClient(t.app);
    await outsider
      .post('/auth/signup', {
        organizationName: 'Outsider Holdings',
        name: 'Out Sider',
        email: uniqueEmail('outsider'),
        password: 'not-a-member-anywhere-1',
      })
      .expect(201);
  });

  it('covers every organisation route', () => {
    expect(orgRoutes.length).toBeGreaterThanOrEqual(8);
    for (const r of orgRoutes) {
      // A route naming another object and taking a body needs a valid one, or validation would answer first.
      if (r.body && OBJECT_IDS.test(r.path)) {
        expect(validBodies[routeKey(r)], `${routeKey(r)} needs a valid body here`).toBeDefined();
      }
    }
  });

  it.each(orgRoutes.map((r) => [routeKey(r), r] as const))(
    "%s with the other organisation's id: 404, nothing changed",
    async (key, route) => {
      const before = await snapshotTables(t.db.sequelize);
      const url = probeUrl(route, { ...aObjects(), orgId: a.id }).replace(/^\/api\/v1/, '');
      const body = route.method === 'get' || route.method === 'delete' ? undefined : (validBodies[key] ?? {});
      for (const client of [bOwner, outsider]) {
        const res = await client.send(route.method, url, body);
        expect(res.status, `${key}: ${res.text}`).toBe(404);
        expect(res.body.error.message).toBe('Organisation not found');
      }
      expect(await snapshotTables(t.db.sequelize)).toEqual(before);
    },
  );

  it('answers an organisation that does not exist exactly as one that is not yours', async () => {
    const theirs = await bOwner.get(`/orgs/${a.id}/members`);
    const none = await bOwner.get(`/orgs/4000000000/members`);
    expect(theirs.status).toBe(404);
    expect(none.body).toEqual(theirs.body);
  });

  const crossObject = orgRoutes.filter((r) => OBJECT_IDS.test(r.path));
  it.each(crossObject.map((r) => [routeKey(r), r] as const))(
    "%s in its own organisation naming the other's member, invitation, widget, run or lead: 404, nothing changed",
    async (key, route) => {
      const before = await snapshotTables(t.db.sequelize);
      const url = probeUrl(route, { ...aObjects(), orgId: b.id }).replace(/^\/api\/v1/, '');
      const body = route.method === 'get' || route.method === 'delete' ? undefined : (validBodies[key] ?? {});
      const res = await bOwner.send(route.method, url, body);
      expect(res.status, `${key}: ${res.text}`).toBe(404);
      expect(await snapshotTables(t.db.sequelize)).toEqual(before);
    },
  );

  it('lists only its own members and its own audit', async () => {
    const members = (await bOwner.get(`/orgs/${b.id}/members`).expect(200)).body as {
      items: Array<{ email: string }>;
      invitations: Array<{ id: number }>;
    };
    const aEmails = Object.values(a.users).map((u) => u.email);
    expect(members.items.map((m) => m.email).filter((e) => aEmails.includes(e))).toEqual([]);
    expect(members.invitations.map((i) => i.id)).not.toContain(aInvitationId);
    const audit = (await bOwner.get(`/orgs/${b.id}/audit?pageSize=200`).expect(200)).body as {
      items: Array<{ subject: string | null }>;
    };
    expect(audit.items.map((e) => e.subject).filter((s) => s !== null && aEmails.includes(s))).toEqual([]);
    const runs = (await bOwner.get(`/orgs/${b.id}/runs?pageSize=200`).expect(200)).body as {
      items: Array<{ id: string }>;
      total: number;
    };
    expect(runs).toEqual({ items: [], total: 0 });
    const leads = (await bOwner.get(`/orgs/${b.id}/leads?pageSize=200`).expect(200)).body as {
      items: Array<{ id: number }>;
      total: number;
    };
    expect(leads).toEqual({ items: [], total: 0 });
    const usage = (await bOwner.get(`/orgs/${b.id}/usage/summary`).expect(200)).body as {
      totals: { runs: number };
    };
    expect(usage.totals.runs).toBe(0);
    const csv = await bOwner.get(`/orgs/${b.id}/runs/export`).expect(200);
    expect(csv.text).not.toContain(aRunId);
    expect((await bOwner.get(`/orgs/${b.id}/leads/export`).expect(200)).text).not.toContain('Hester');
    expect(await Invitation.count({ where: { id: aInvitationId } })).toBe(1);
    expect(await User.count({ where: { email: a.users.analyst.email } })).toBe(1);
  });
});

afterAll(async () => {
  await t.close();
});
