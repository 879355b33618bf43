import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { devMailResponseSchema } from '@wickstone/contracts';
import { createApp } from '../app.js';
import { createLogger } from '../logger.js';
import { TestClient, createTestApp, type TestApp } from '../../testing/client.js';
import { seedOrgWithTeam, uniqueEmail } from '../../testing/fixtures.js';

describe('GET /api/v1/dev/mail', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('lists what the fake SMTP server kept: to, subject, text and links, newest first', async () => {
    const org = await seedOrgWithTeam('Withy Bed Surveys');
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    const email = uniqueEmail('devmail');
    await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'analyst' }).expect(201);
    await owner.post(`/orgs/${org.id}/invitations`, { email, role: 'developer' }).expect(201);

    const res = await request(t.app)
      .get(`/api/v1/dev/mail?to=${encodeURIComponent(email)}`)
      .expect(200);
    const { items } = devMailResponseSchema.parse(res.body);
    expect(items).toHaveLength(2);
    expect(items[0]).toMatchObject({ to: [email], subject: 'Join Withy Bed Surveys on Wickstone' });
    expect(items[0]?.text).toContain('as a developer');
    expect(items[1]?.text).toContain('as an analyst');
    expect(items[0]?.links.some((l) => l.startsWith(`${t.db.config.publicUrl}/invitations/`))).toBe(true);
    expect(Object.keys(items[0]!)).not.toContain('html');
  });

  it('does not exist when no fake mailbox is configured', async () => {
    const config = { ...t.db.config, mail: { ...t.db.config.mail, fakeApiUrl: undefined } };
    const real = createApp({ config, sequelize: t.db.sequelize, logger: createLogger(config) });
    const res = await request(real).get('/api/v1/dev/mail');
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('No route for GET /api/v1/dev/mail');
  });

  it('answers 503 when the fake mailbox is configured but not running', async () => {
    const config = { ...t.db.config, mail: { ...t.db.config.mail, fakeApiUrl: 'http://127.0.0.1:9' } };
    const broken = createApp({ config, sequelize: t.db.sequelize, logger: createLogger(config) });
    const res = await request(broken).get('/api/v1/dev/mail');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('service_unavailable');
  });
});
