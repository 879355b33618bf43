import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditResponseSchema,
  invitationPreviewSchema,
  invitationSchema,
  meResponseSchema,
  membersResponseSchema,
} from '@wickstone/contracts';
import { Invitation, Membership } from '../db/models/index.js';
import { TestClient, createTestApp, linkToken, mailbox, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, uniqueEmail, type FixtureOrg } from '../../testing/fixtures.js';

describe('invitations', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let admin: TestClient;
  const inbox = (to: string, n = 1) => mailbox(t.db.config.mail.fakeApiUrl, to, n);

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam('Saltmarsh Geotechnical');
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    admin = new TestClient(t.app);
    await admin.login(org.users.admin.email, org.users.admin.password);
  });
  afterAll(async () => {
    await t.close();
  });

  it('invites a new person by e-mail; they open the link, make an account and join with the role', async () => {
    const email = uniqueEmail('newcomer');
    const res = await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'analyst' }).expect(201);
    const inv = invitationSchema.parse(res.body);
    expect(inv).toMatchObject({ email, role: 'analyst', invitedBy: org.users.owner.name });

    const [message] = await inbox(email);
    expect(message?.subject).toBe('Join Saltmarsh Geotechnical on Wickstone');
    expect(message?.text).toContain(
      `${org.users.owner.name} has invited you to join Saltmarsh Geotechnical on Wickstone as an analyst.`,
    );
    expect(message?.html).toContain('<strong>Saltmarsh Geotechnical</strong>');
    const token = linkToken(message!, 'invitations');
    expect(message?.links).toContain(`${t.db.config.publicUrl}/invitations/${token}`);

    const visitor = new TestClient(t.app);
    const preview = invitationPreviewSchema.parse(
      (await visitor.get(`/invitations/${token}`).expect(200)).body,
    );
    expect(preview).toMatchObject({
      email,
      role: 'analyst',
      organizationName: 'Saltmarsh Geotechnical',
      existingUser: false,
    });

    const missing = await visitor
      .post(`/invitations/${token}/accept`, { password: 'wetted-perimeter-9' })
      .expect(400);
    expect(missing.body.error.details.fields).toEqual([
      { field: 'body.name', message: 'Required for a new account' },
    ]);
    const common = await visitor
      .post(`/invitations/${token}/accept`, { name: 'Nell Reed', password: 'password123' })
      .expect(400);
    expect(common.body.error.details.fields[0].field).toBe('body.password');

    const joined = meResponseSchema.parse(
      (
        await visitor
          .post(`/invitations/${token}/accept`, { name: 'Nell Reed', password: 'wetted-perimeter-9' })
          .expect(200)
      ).body,
    );
    expect(joined.user).toMatchObject({ email, name: 'Nell Reed' });
    expect(joined.memberships).toEqual([
      { organizationId: org.id, organizationName: 'Saltmarsh Geotechnical', role: 'analyst' },
    ]);
    // Signed in as the new member straight away, and the link is spent.
    await visitor.get('/auth/me').expect(200);
    await visitor.get(`/invitations/${token}`).expect(404);
    await new TestClient(t.app)
      .post(`/invitations/${token}/accept`, { name: 'Someone Else', password: 'wetted-perimeter-9' })
      .expect(404);

    const audit = auditResponseSchema.parse((await owner.get(`/orgs/${org.id}/audit`).expect(200)).body);
    const [joinedEvent, invitedEvent] = audit.items.filter((e) => e.subject === email);
    expect(joinedEvent).toMatchObject({
      type: 'member.joined',
      actor: { email },
      details: { role: 'analyst', newAccount: true },
    });
    expect(invitedEvent).toMatchObject({
      type: 'member.invited',
      actor: { id: org.users.owner.id },
      details: { role: 'analyst' },
    });
  });

  it('invites a person who already has an account: they prove it with their password, or are already signed in', async () => {
    const other = await seedOrgWithTeam('Chalk Downs Damp');
    const person = other.users.developer;
    await owner.post(`/orgs/${org.id}/invitations`, { email: person.email, role: 'developer' }).expect(201);
    const token = linkToken((await inbox(person.email))[0]!, 'invitations');

    const visitor = new TestClient(t.app);
    expect((await visitor.get(`/invitations/${token}`).expect(200)).body.existingUser).toBe(true);
    const noPassword = await visitor.post(`/invitations/${token}/accept`, {}).expect(400);
    expect(noPassword.body.error.details.fields[0].field).toBe('body.password');
    await visitor.post(`/invitations/${token}/accept`, { password: 'not-their-password' }).expect(401);
    const me = meResponseSchema.parse(
      (await visitor.post(`/invitations/${token}/accept`, { password: person.password }).expect(200)).body,
    );
    expect(me.user.id).toBe(person.id);
    expect(me.memberships.map((m) => [m.organizationName, m.role]).sort()).toEqual([
      ['Chalk Downs Damp', 'developer'],
      ['Saltmarsh Geotechnical', 'developer'],
    ]);

    // Signed in as the invited account, no password is asked.
    const person2 = other.users.analyst;
    await owner.post(`/orgs/${org.id}/invitations`, { email: person2.email, role: 'analyst' }).expect(201);
    const token2 = linkToken((await inbox(person2.email))[0]!, 'invitations');
    const signedIn = new TestClient(t.app);
    await signedIn.login(person2.email, person2.password);
    await signedIn.post(`/invitations/${token2}/accept`, {}).expect(200);
    expect(await Membership.count({ where: { organizationId: org.id, userId: person2.id } })).toBe(1);
  });

  it('refuses to invite someone who is already a member, and lets only an owner invite an owner', async () => {
    const dup = await owner
      .post(`/orgs/${org.id}/invitations`, { email: org.users.analyst.email, role: 'analyst' })
      .expect(409);
    expect(dup.body.error.details.fields).toEqual([{ field: 'body.email', message: 'Already a member' }]);
    await admin
      .post(`/orgs/${org.id}/invitations`, { email: uniqueEmail('boss'), role: 'owner' })
      .expect(403);
    await admin
      .post(`/orgs/${org.id}/invitations`, { email: uniqueEmail('helper'), role: 'admin' })
      .expect(201);
    await owner
      .post(`/orgs/${org.id}/invitations`, { email: uniqueEmail('co-owner'), role: 'owner' })
      .expect(201);
  });

  it('re-sends an invitation with a new link (the old one stops working) and withdraws one', async () => {
    const email = uniqueEmail('resend');
    const inv = invitationSchema.parse(
      (await admin.post(`/orgs/${org.id}/invitations`, { email, role: 'developer' }).expect(201)).body,
    );
    const first = linkToken((await inbox(email))[0]!, 'invitations');
    await admin.post(`/orgs/${org.id}/invitations/${inv.id}/resend`).expect(200);
    const messages = await inbox(email, 2);
    expect(messages).toHaveLength(2);
    const second = linkToken(messages[0]!, 'invitations');
    expect(second).not.toBe(first);
    await new TestClient(t.app).get(`/invitations/${first}`).expect(404);
    await new TestClient(t.app).get(`/invitations/${second}`).expect(200);

    const listed = membersResponseSchema.parse((await admin.get(`/orgs/${org.id}/members`).expect(200)).body);
    expect(listed.invitations.filter((i) => i.email === email)).toHaveLength(1);

    await admin.delete(`/orgs/${org.id}/invitations/${inv.id}`).expect(204);
    await new TestClient(t.app).get(`/invitations/${second}`).expect(404);
    expect(await Invitation.count({ where: { id: inv.id } })).toBe(0);
    const audit = auditResponseSchema.parse((await admin.get(`/orgs/${org.id}/audit`).expect(200)).body);
    const events = audit.items.filter((e) => e.subject === email);
    expect(events.map((e) => e.type)).toEqual(['member.removed', 'member.invited', 'member.invited']);
    expect(events[0]?.details).toMatchObject({ pendingInvitation: true, invitationId: inv.id });
    expect(events[1]?.details).toMatchObject({ resent: true });
  });

  it('inviting an address again replaces its pending invitation', async () => {
    const email = uniqueEmail('twice');
    await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'analyst' }).expect(201);
    await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'developer' }).expect(201);
    const rows = await Invitation.findAll({ where: { organizationId: org.id, email } });
    expect(rows.map((r) => r.role)).toEqual(['developer']);
  });

  it('shows pending invitations only to those who manage members', async () => {
    const analyst = new TestClient(t.app);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    const seen = membersResponseSchema.parse((await analyst.get(`/orgs/${org.id}/members`).expect(200)).body);
    expect(seen.items.length).toBeGreaterThanOrEqual(4);
    expect(seen.invitations).toEqual([]);
    const managed = membersResponseSchema.parse(
      (await owner.get(`/orgs/${org.id}/members`).expect(200)).body,
    );
    expect(managed.invitations.length).toBeGreaterThan(0);
  });

  it('refuses an expired invitation', async () => {
    const email = uniqueEmail('late');
    const inv = invitationSchema.parse(
      (await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'analyst' }).expect(201)).body,
    );
    const token = linkToken((await inbox(email))[0]!, 'invitations');
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { id: inv.id } });
    await new TestClient(t.app).get(`/invitations/${token}`).expect(404);
    await new TestClient(t.app)
      .post(`/invitations/${token}/accept`, { name: 'Late Comer', password: 'too-late-for-this-1' })
      .expect(404);
  });
});
