import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitationSchema } from '@wickstone/contracts';
import { loadConfig } from '../config.js';
import { Invitation } from '../db/models/index.js';
import { createSmtpMailer, type Mailer } from '../mail/mailer.js';
import { TestClient, createTestApp, linkToken, mailbox, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, uniqueEmail } from '../../testing/fixtures.js';

describe('when the mail relay is down', () => {
  let t: TestApp;
  let relayDown = true;
  const sent: string[] = [];
  beforeAll(async () => {
    // The real SMTP mailer, behind a switch that first points it at a port where nothing listens.
    const config = loadConfig({ ...process.env, NODE_ENV: 'test' });
    const real = createSmtpMailer(config.mail);
    const dead = createSmtpMailer({ ...config.mail, smtpPort: 9 });
    const mailer: Mailer = {
      async send(m) {
        await (relayDown ? dead : real).send(m);
        sent.push(m.to);
      },
      close() {
        real.close();
        dead.close();
      },
    };
    t = await createTestApp({}, { mailer });
  });
  afterAll(async () => {
    await t.close();
  });

  it('keeps the invitation, answers normally, and the invitation can be re-sent later', async () => {
    const org = await seedOrgWithTeam();
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    const email = uniqueEmail('relay');
    const res = await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'analyst' }).expect(201);
    const inv = invitationSchema.parse(res.body);
    expect(await Invitation.count({ where: { id: inv.id } })).toBe(1);
    expect(sent).not.toContain(email);
    expect(await mailbox(t.db.config.mail.fakeApiUrl, email, 1, 300)).toEqual([]);

    relayDown = false;
    await owner.post(`/orgs/${org.id}/invitations/${inv.id}/resend`).expect(200);
    const [message] = await mailbox(t.db.config.mail.fakeApiUrl, email);
    await new TestClient(t.app).get(`/invitations/${linkToken(message!, 'invitations')}`).expect(200);
  });

  it('still answers a password-reset request the same way', async () => {
    relayDown = true;
    const org = await seedOrgWithTeam();
    const res = await new TestClient(t.app).post('/auth/password/forgot', { email: org.users.analyst.email });
    expect(res.status).toBe(202);
  });
});
