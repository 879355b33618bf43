import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditResponseSchema,
  memberSchema,
  membersResponseSchema,
  organizationResponseSchema,
} from '@wickstone/contracts';
import { Membership } from '../db/models/index.js';
import { TestClient, createTestApp, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, type FixtureOrg } from '../../testing/fixtures.js';

describe('members: roles and removal', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function team(): Promise<{ org: FixtureOrg; owner: TestClient; admin: TestClient }> {
    const org = await seedOrgWithTeam();
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    const admin = new TestClient(t.app);
    await admin.login(org.users.admin.email, org.users.admin.password);
    return { org, owner, admin };
  }
  const roleOf = async (orgId: number, userId: number) =>
    (await Membership.findOne({ where: { organizationId: orgId, userId } }))?.role;

  it('reads the organisation and lists its members', async () => {
    const { org, owner } = await team();
    const me = organizationResponseSchema.parse((await owner.get(`/orgs/${org.id}`).expect(200)).body);
    expect(me).toMatchObject({ id: org.id, name: org.name, role: 'owner' });
    const list = membersResponseSchema.parse((await owner.get(`/orgs/${org.id}/members`).expect(200)).body);
    expect(list.items.map((m) => m.role).sort()).toEqual(['admin', 'analyst', 'developer', 'owner']);
  });

  it('changes a role and records who did it', async () => {
    const { org, admin } = await team();
    const res = await admin
      .patch(`/orgs/${org.id}/members/${org.users.analyst.id}`, { role: 'developer' })
      .expect(200);
    expect(memberSchema.parse(res.body)).toMatchObject({ userId: org.users.analyst.id, role: 'developer' });
    expect(await roleOf(org.id, org.users.analyst.id)).toBe('developer');
    const audit = auditResponseSchema.parse((await admin.get(`/orgs/${org.id}/audit`).expect(200)).body);
    expect(audit.items[0]).toMatchObject({
      type: 'member.role_changed',
      actor: { id: org.users.admin.id },
      subject: org.users.analyst.email,
      details: { from: 'analyst', to: 'developer' },
    });
  });

  it('an admin can neither make an owner nor change or remove one', async () => {
    const { org, admin } = await team();
    const made = await admin
      .patch(`/orgs/${org.id}/members/${org.users.analyst.id}`, { role: 'owner' })
      .expect(403);
    expect(made.body.error.code).toBe('forbidden');
    await admin.patch(`/orgs/${org.id}/members/${org.users.admin.id}`, { role: 'owner' }).expect(403);
    await admin.patch(`/orgs/${org.id}/members/${org.users.owner.id}`, { role: 'analyst' }).expect(403);
    await admin.delete(`/orgs/${org.id}/members/${org.users.owner.id}`).expect(403);
    expect(await roleOf(org.id, org.users.analyst.id)).toBe('analyst');
    expect(await roleOf(org.id, org.users.admin.id)).toBe('admin');
    expect(await roleOf(org.id, org.users.owner.id)).toBe('owner');
  });

  it('the last owner can be neither demoted nor removed; with a second owner they can', async () => {
    const { org, owner } = await team();
    const demote = await owner
      .patch(`/orgs/${org.id}/members/${org.users.owner.id}`, { role: 'admin' })
      .expect(409);
    expect(demote.body.error.message).toMatch(/last owner/);
    await owner.delete(`/orgs/${org.id}/members/${org.users.owner.id}`).expect(409);
    expect(await roleOf(org.id, org.users.owner.id)).toBe('owner');

    await owner.patch(`/orgs/${org.id}/members/${org.users.admin.id}`, { role: 'owner' }).expect(200);
    await owner.patch(`/orgs/${org.id}/members/${org.users.owner.id}`, { role: 'admin' }).expect(200);
    expect(await roleOf(org.id, org.users.owner.id)).toBe('admin');
    // The former owner is an admin now, and the new owner is the last one.
    await owner.patch(`/orgs/${org.id}/members/${org.users.admin.id}`, { role: 'analyst' }).expect(403);
  });

  it('two owners demoting each other at the same moment leave one owner', async () => {
    const { org, owner } = await team();
    await owner.patch(`/orgs/${org.id}/members/${org.users.admin.id}`, { role: 'owner' }).expect(200);
    const other = new TestClient(t.app);
    await other.login(org.users.admin.email, org.users.admin.password);
    const results = await Promise.all([
      owner.patch(`/orgs/${org.id}/members/${org.users.admin.id}`, { role: 'analyst' }),
      other.patch(`/orgs/${org.id}/members/${org.users.owner.id}`, { role: 'analyst' }),
    ]);
    // The second is refused either as no longer an owner (403, if the first finished before it was
    // checked) or as the last owner's demotion (409, if it waited for the first inside the change).
    const [first, second] = results.map((r) => r.status).sort();
    expect(first).toBe(200);
    expect([403, 409]).toContain(second);
    expect(await Membership.count({ where: { organizationId: org.id, role: 'owner' } })).toBe(1);
  });

  it('removes a member, who then loses access to the organisation', async () => {
    const { org, owner } = await team();
    const dev = new TestClient(t.app);
    await dev.login(org.users.developer.email, org.users.developer.password);
    await dev.get(`/orgs/${org.id}/members`).expect(200);
    await owner.delete(`/orgs/${org.id}/members/${org.users.developer.id}`).expect(204);
    await dev.get(`/orgs/${org.id}/members`).expect(404);
    await owner.delete(`/orgs/${org.id}/members/${org.users.developer.id}`).expect(404);
    const audit = auditResponseSchema.parse((await owner.get(`/orgs/${org.id}/audit`).expect(200)).body);
    expect(audit.items[0]).toMatchObject({
      type: 'member.removed',
      subject: org.users.developer.email,
      details: { role: 'developer' },
    });
  });
});
