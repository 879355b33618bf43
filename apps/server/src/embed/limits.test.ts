import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { errorBodySchema, type Widget } from '@wickstone/contracts';
import {
  createLiveWidget,
  createTestApp,
  mailbox,
  runReportBody,
  seedOrgWithTeam,
  TestClient,
  uniqueEmail,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { Lead } from '../db/models/index.js';

const SITE = 'https://www.hollins-moisture.example';

/*
 * Lead limits per widget (2 accepted per client address and widget, 3 per address over all widgets)
 * and result-copy limits (2 per recipient address, 3 per widget). The app trusts X-Forwarded-For
 * here, so each test speaks from its own documentation-range address.
 */
describe('lead and result-copy limits', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let widgets: Widget[];

  beforeAll(async () => {
    t = await createTestApp({
      TRUST_PROXY: 'true',
      LEAD_LIMIT_PER_IP: '2',
      LEAD_LIMIT_PER_IP_ALL_WIDGETS: '3',
      COPY_LIMIT_PER_RECIPIENT: '2',
      COPY_LIMIT_PER_WIDGET: '3',
    });
    org = await seedOrgWithTeam();
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    widgets = [];
    for (const name of ['Slot rise', 'Tube rise', 'Third widget']) {
      widgets.push(
        await createLiveWidget(owner, org.id, name, [SITE], (settings) => {
          settings.leadForm.notify = [uniqueEmail('firm')];
        }),
      );
    }
  });
  afterAll(() => t.close());

  async function newRun(w: Widget): Promise<string> {
    const id = randomUUID();
    await request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(runReportBody(w.publicKey, { id })))
      .expect(201);
    return id;
  }

  async function lead(
    w: Widget,
    from: string,
    fields: Record<string, string> = { name: 'Orla Penhallow', email: uniqueEmail('visitor') },
    extra: { sendCopy?: boolean; runId?: string } = {},
  ) {
    const runId = extra.runId ?? (await newRun(w));
    return request(t.app)
      .post('/api/v1/embed/leads')
      .set('Origin', SITE)
      .set('X-Forwarded-For', from)
      .set('Content-Type', 'text/plain')
      .send(
        JSON.stringify({
          runId,
          publicKey: w.publicKey,
          fields,
          consent: true,
          sendCopy: extra.sendCopy ?? false,
        }),
      );
  }

  it('scopes the lead limit per widget, under a higher ceiling over all widgets', async () => {
    const [a, b, c] = widgets as [Widget, Widget, Widget];
    const from = '203.0.113.40';
    expect((await lead(a, from)).status).toBe(201);
    expect((await lead(a, from)).status).toBe(201);
    const third = await lead(a, from);
    expect(third.status).toBe(429);
    expect(errorBodySchema.parse(third.body).error.code).toBe('rate_limited');
    expect(third.headers['ratelimit-policy']).toMatch(/q=2/);
    // Another widget is not affected by this widget's count...
    expect((await lead(b, from)).status).toBe(201);
    // ...until the ceiling over all widgets (3) is reached.
    const ceiling = await lead(c, from);
    expect(ceiling.status).toBe(429);
    expect(ceiling.headers['ratelimit-policy']).toMatch(/q=3/);
    // Another visitor is not affected at all.
    expect((await lead(a, '203.0.113.41')).status).toBe(201);
  });

  it('counts only accepted requests: refused ones do not use up the limit', async () => {
    const [a] = widgets as [Widget];
    const from = '203.0.113.50';
    for (let i = 0; i < 6; i++) {
      const refused = await lead(
        a,
        from,
        { name: 'Orla Penhallow', email: uniqueEmail() },
        { runId: randomUUID() },
      );
      expect(refused.status).toBe(400);
    }
    const missingEmail = await lead(a, from, { name: 'Orla Penhallow' });
    expect(missingEmail.status).toBe(400);
    expect((await lead(a, from)).status).toBe(201);
    expect((await lead(a, from)).status).toBe(201);
    expect((await lead(a, from)).status).toBe(429);
  });

  it('mails at most 2 copies to one recipient; the requests themselves are all stored', async () => {
    const [, b] = widgets as [Widget, Widget];
    const visitor = uniqueEmail('copy-target');
    const ids: number[] = [];
    for (const [i, from] of ['198.51.100.60', '198.51.100.61', '198.51.100.62'].entries()) {
      const res = await lead(b, from, { name: `Visitor ${i}`, email: visitor }, { sendCopy: true });
      expect(res.status).toBe(201);
      ids.push(res.body.id as number);
    }
    expect(await Lead.count({ where: { email: visitor } })).toBe(3);
    const copies = await mailbox(t.db.config.mail.fakeApiUrl, visitor, 3, 1_500);
    expect(copies).toHaveLength(2);
  });

  it('mails at most 3 copies from one widget, whoever they are for', async () => {
    const [, , c] = widgets as [Widget, Widget, Widget];
    const visitors = [1, 2, 3, 4].map((i) => uniqueEmail(`widget-copy-${i}`));
    for (const [i, email] of visitors.entries()) {
      const res = await lead(c, `198.51.100.${70 + i}`, { name: 'Visitor', email }, { sendCopy: true });
      expect(res.status).toBe(201);
    }
    const got = await Promise.all(visitors.map((v) => mailbox(t.db.config.mail.fakeApiUrl, v, 1, 1_000)));
    expect(got.map((m) => m.length)).toEqual([1, 1, 1, 0]);
  });

  it('puts nothing the visitor typed in a copy but their name, and says why it came', async () => {
    const [a] = widgets as [Widget];
    const visitor = uniqueEmail('content');
    const res = await lead(
      a,
      '192.0.2.80',
      {
        name: 'Tamsin Roskilly',
        email: visitor,
        company: 'Click https://phish.example now',
        siteAddress: 'Visit https://phish.example/login',
        message: 'Your account is locked: https://phish.example',
      },
      { sendCopy: true },
    );
    expect(res.status).toBe(201);
    // The firm's own notice carries everything the visitor wrote; the visitor's copy does not.
    const [copy] = await mailbox(t.db.config.mail.fakeApiUrl, visitor);
    expect(copy?.text).toContain('Hello Tamsin Roskilly,');
    expect(copy?.text).toMatch(/You received this e-mail because this address was entered/);
    expect(copy?.text).toMatch(/If that was not you, you can ignore it/);
    expect(copy?.text).toContain(SITE);
    expect(copy?.text).not.toContain('phish.example');
    expect(copy?.html).not.toContain('phish.example');
  });
});
