import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditResponseSchema, type AuditEntry } from '@wickstone/contracts';
import { AuditEvent, Membership } from '../db/models/index.js';
import { TestClient, createTestApp, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, uniqueEmail, type FixtureOrg } from '../../testing/fixtures.js';

describe('the audit log', () => {
  let t: TestApp;
  let a: FixtureOrg;
  let b: FixtureOrg;
  let aOwner: TestClient;
  let bOwner: TestClient;
  const read = async (client: TestClient, orgId: number, query = 'pageSize=200') =>
    auditResponseSchema.parse((await client.get(`/orgs/${orgId}/audit?${query}`).expect(200)).body);

  beforeAll(async () => {
    t = await createTestApp();
    a = await seedOrgWithTeam('Heathfield Soils');
    b = await seedOrgWithTeam('Mere Bank Moisture');
    // The analyst of A also belongs to B.
    await Membership.create({ organizationId: b.id, userId: a.users.analyst.id, role: 'analyst' });
    aOwner = new TestClient(t.app);
    await aOwner.login(a.users.owner.email, a.users.owner.password);
    bOwner = new TestClient(t.app);
    await bOwner.login(b.users.owner.email, b.users.owner.password);
  });
  afterAll(async () => {
    await t.close();
  });

  it('records sign-ins with who and from where', async () => {
    const items = (await read(aOwner, a.id)).items;
    const login = items.find((e) => e.type === 'auth.login' && e.actor?.id === a.users.owner.id);
    expect(login).toMatchObject({ subject: a.users.owner.email, ip: expect.stringMatching(/127\.0\.0\.1/) });
  });

  it('records a failed sign-in, with the address tried, in every organisation of that person', async () => {
    const res = await new TestClient(t.app).post('/auth/login', {
      email: a.users.analyst.email,
      password: 'guessing-wrongly',
    });
    expect(res.status).toBe(401);
    for (const [client, orgId] of [
      [aOwner, a.id],
      [bOwner, b.id],
    ] as const) {
      const failed = (await read(client, orgId)).items.find((e) => e.type === 'auth.login_failed');
      expect(failed).toMatchObject({
        actor: null,
        subject: a.users.analyst.email,
        details: { email: a.users.analyst.email },
      });
    }
  });

  it('keeps a failed sign-in for an unknown address out of every organisation', async () => {
    const nobody = uniqueEmail('nobody');
    await new TestClient(t.app)
      .post('/auth/login', { email: nobody, password: 'guessing-wrongly' })
      .expect(401);
    const rows = await AuditEvent.findAll({ where: { subject: nobody } });
    expect(rows.map((r) => [r.type, r.organizationId, r.details])).toEqual([
      ['auth.login_failed', null, { email: nobody, reason: 'unknown address' }],
    ]);
    for (const [client, orgId] of [
      [aOwner, a.id],
      [bOwner, b.id],
    ] as const) {
      expect((await read(client, orgId)).items.some((e) => e.subject === nobody)).toBe(false);
    }
  });

  it('pages newest first, without gaps or overlaps', async () => {
    for (let i = 0; i < 3; i++)
      await new TestClient(t.app).login(a.users.developer.email, a.users.developer.password);
    const all = await read(aOwner, a.id);
    expect(all.total).toBe(all.items.length);
    const ids = all.items.map((e) => e.id);
    expect(ids).toEqual([...ids].sort((x, y) => y - x));
    const pages: AuditEntry[] = [];
    for (let page = 1; page <= Math.ceil(all.total / 2); page++) {
      const p = await read(aOwner, a.id, `page=${page}&pageSize=2`);
      expect(p.total).toBe(all.total);
      pages.push(...p.items);
    }
    expect(pages.map((e) => e.id)).toEqual(ids);
    expect((await read(aOwner, a.id, `page=${all.total + 1}&pageSize=2`)).items).toEqual([]);
  });

  it('shows each organisation only its own events', async () => {
    const bIds = new Set(
      (await AuditEvent.findAll({ where: { organizationId: b.id } })).map((e) => Number(e.id)),
    );
    const aItems = (await read(aOwner, a.id)).items;
    expect(aItems.length).toBeGreaterThan(0);
    expect(aItems.filter((e) => bIds.has(e.id))).toEqual([]);
  });
});
