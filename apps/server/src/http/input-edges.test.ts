import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { errorBodySchema, type Widget } from '@wickstone/contracts';
import {
  createLiveWidget,
  createTestApp,
  makePng,
  makeZip,
  runReportBody,
  seedOrgWithTeam,
  snapshotTables,
  TestClient,
  uniqueEmail,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { Asset } from '../db/models/index.js';

const SITE = 'https://www.tregarthen-survey.example';
const fieldsOf = (body: unknown) =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string }[] }).fields.map((f) => f.field);
// U+202E RIGHT-TO-LEFT OVERRIDE and U+2066 LEFT-TO-RIGHT ISOLATE (common practice: refused in display names)
const RLO = '\u202E';
const LRI = '\u2066';

describe('input edges', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let widget: Widget;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    widget = await createLiveWidget(owner, org.id, 'Edge rise', [SITE]);
  });
  afterAll(() => t.close());

  const runBody = (pageUrl: string) => runReportBody(widget.publicKey, { id: randomUUID(), pageUrl });
  const report = (body: unknown) =>
    request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(body));

  it.each([
    'javascript:alert(document.domain)',
    'data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==',
    'file:///etc/passwd',
    'ftp://files.tregarthen-survey.example/a',
  ])('refuses the run report page address %s, naming body.pageUrl, storing nothing', async (pageUrl) => {
    const before = await snapshotTables(t.db.sequelize);
    const res = await report(runBody(pageUrl)).expect(400);
    expect(fieldsOf(res.body)).toEqual(['body.pageUrl']);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });

  it('accepts http and https page addresses', async () => {
    await report(runBody(`${SITE}/ground/rising-damp?from=menu`)).expect(201);
    await report(runBody('http://www.tregarthen-survey.example/old-page')).expect(201);
  });

  it('refuses text-direction controls in every display name, naming the field', async () => {
    const before = await snapshotTables(t.db.sequelize, ['audit_events']);
    const anon = new TestClient(t.app);
    const signup = await anon
      .post('/auth/signup', {
        organizationName: `Survey ${LRI}Ltd`,
        name: `Kit ${RLO}exe.gnp`,
        email: uniqueEmail('bidi'),
        password: 'a-long-enough-passphrase-2026',
      })
      .expect(400);
    expect(fieldsOf(signup.body).sort()).toEqual(['body.name', 'body.organizationName']);
    const account = await owner.patch('/auth/me', { name: `Owner${RLO}` }).expect(400);
    expect(fieldsOf(account.body)).toEqual(['body.name']);
    const widgetName = await owner
      .post(`/orgs/${org.id}/widgets`, { name: `Rise ${RLO}check`, calculatorId: 'tube-rise' })
      .expect(400);
    expect(fieldsOf(widgetName.body)).toEqual(['body.name']);
    const lead = await request(t.app)
      .post('/api/v1/embed/leads')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain')
      .send(
        JSON.stringify({
          runId: randomUUID(),
          publicKey: widget.publicKey,
          fields: { name: `Visitor ${RLO}moc.elpmaxe`, email: uniqueEmail() },
          consent: true,
        }),
      )
      .expect(400);
    expect(fieldsOf(lead.body)).toEqual(['body.fields.name']);
    expect(await snapshotTables(t.db.sequelize, ['audit_events'])).toEqual(before);
  });

  describe('logo uploads are decoded and encoded again', () => {
    const upload = (data: Buffer) =>
      owner
        .csrf()
        .then((token) =>
          owner.agent
            .post(`/api/v1/orgs/${org.id}/assets`)
            .set('x-csrf-token', token)
            .attach('file', data, { filename: 'logo.png', contentType: 'image/png' }),
        );
    const html = Buffer.from('<!doctype html><script>fetch("/api/v1/auth/me")</script>');
    const zip = () => makeZip('a.htm', html);
    const header = () => makePng(4, 4).subarray(0, 33); // PNG signature and a valid IHDR chunk

    it.each([
      ['a PNG header followed by HTML', () => Buffer.concat([header(), html])],
      ['a PNG header followed by a ZIP archive', () => Buffer.concat([header(), zip()])],
    ])('refuses %s, naming the file, storing nothing', async (_what, make) => {
      const before = await Asset.count();
      const res = await upload(make());
      expect(res.status).toBe(400);
      expect(fieldsOf(res.body)).toEqual(['file']);
      expect(await Asset.count()).toBe(before);
    });

    it('stores only the pixels of a whole PNG that carries an archive behind it', async () => {
      const res = await upload(Buffer.concat([makePng(12, 6), zip(), html]));
      expect(res.status).toBe(201);
      const stored = await Asset.findByPk(res.body.id as number);
      expect(stored).toMatchObject({ width: 12, height: 6, contentType: 'image/png' });
      expect(stored?.data.includes(Buffer.from('PK\u0003\u0004', 'latin1'))).toBe(false);
      expect(stored?.data.includes(Buffer.from('<script'))).toBe(false);
      expect(stored?.bytes).toBe(stored?.data.length);
    });
  });
});
