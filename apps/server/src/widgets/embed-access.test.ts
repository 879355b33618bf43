import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  errorBodySchema,
  orgRefusedOriginsSchema,
  refusedOriginsSchema,
  widgetSchema,
  type Widget,
} from '@wickstone/contracts';
import {
  createLiveWidget,
  createTestApp,
  runReportBody,
  seedOrgWithTeam,
  snapshotTables,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';

const SITE = 'https://www.marlpit-damp.example';
const FORGOTTEN = 'https://shop.marlpit-damp.example';
const STRANGER = 'https://copycat.example';
const fieldsOf = (body: unknown) =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string }[] }).fields.map((f) => f.field);

describe('embed access: allowed origins and refused ones', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let developer: TestClient;
  let analyst: TestClient;
  let widget: Widget;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    const owner = new TestClient(t.app);
    developer = new TestClient(t.app);
    analyst = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    await developer.login(org.users.developer.email, org.users.developer.password);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    widget = await createLiveWidget(owner, org.id, 'Basement moisture', [SITE]);
  });
  afterAll(() => t.close());

  const settings = (origin: string) =>
    request(t.app).get(`/api/v1/embed/widgets/${widget.publicKey}`).set('Origin', origin);

  it('counts the embed API’s refusals per origin and day; allowed sites and other refusals are not counted', async () => {
    await settings(SITE).expect(200);
    await settings(FORGOTTEN).expect(403);
    await settings(FORGOTTEN).expect(403);
    await request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', FORGOTTEN)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(runReportBody(widget.publicKey, { id: randomUUID() })))
      .expect(403);
    await settings(STRANGER).expect(403);
    // No Origin header at all: nothing to name, nothing counted.
    await request(t.app).get(`/api/v1/embed/widgets/${widget.publicKey}`).expect(403);
    const refused = refusedOriginsSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}/refused-origins`).expect(200)).body,
    );
    expect(refused.items.map((i) => [i.origin, i.refusals])).toEqual([
      [FORGOTTEN, 3],
      [STRANGER, 1],
    ]);
    expect(refused.items[0]?.byDay).toHaveLength(1);
    await analyst.get(`/orgs/${org.id}/widgets/${widget.id}/refused-origins`).expect(403);
  });

  it('sums the refusals per origin across the organisation’s widgets in one answer, naming each widget', async () => {
    const owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    const other = await createLiveWidget(owner, org.id, 'Render wicking', [SITE]);
    await request(t.app).get(`/api/v1/embed/widgets/${other.publicKey}`).set('Origin', STRANGER).expect(403);
    await request(t.app).get(`/api/v1/embed/widgets/${other.publicKey}`).set('Origin', STRANGER).expect(403);
    // Another organisation's refusals are not this one's.
    const stranger = await seedOrgWithTeam();
    const theirOwner = new TestClient(t.app);
    await theirOwner.login(stranger.users.owner.email, stranger.users.owner.password);
    const theirs = await createLiveWidget(theirOwner, stranger.id, 'Their widget', [SITE]);
    await request(t.app)
      .get(`/api/v1/embed/widgets/${theirs.publicKey}`)
      .set('Origin', FORGOTTEN)
      .expect(403);

    const all = orgRefusedOriginsSchema.parse(
      (await developer.get(`/orgs/${org.id}/refused-origins`).expect(200)).body,
    );
    // FORGOTTEN: 3 on the first widget; STRANGER: 1 on the first, 2 on the other (most first).
    expect(all.items.map((i) => [i.origin, i.refusals])).toEqual([
      [STRANGER, 3],
      [FORGOTTEN, 3],
    ]);
    expect(all.items[0]?.widgets.map((w) => [w.name, w.refusals])).toEqual([
      ['Render wicking', 2],
      ['Basement moisture', 1],
    ]);
    expect(all.items[1]?.widgets.map((w) => w.id)).toEqual([widget.id]);
    expect(all.items[0]?.lastDay).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    await analyst.get(`/orgs/${org.id}/refused-origins`).expect(403);
  });

  it('the developer adds the forgotten site; it is then served', async () => {
    const res = await developer
      .put(`/orgs/${org.id}/widgets/${widget.id}/origins`, { origins: [SITE, FORGOTTEN] })
      .expect(200);
    expect(widgetSchema.parse(res.body).allowedOrigins).toEqual([SITE, FORGOTTEN]);
    await settings(FORGOTTEN).expect(200);
    const audit = (await developer.get(`/orgs/${org.id}/widgets/${widget.id}/revisions`).expect(200))
      .body as {
      items: { changes: { path: string }[] }[];
    };
    expect(audit.items[0]?.changes.map((c) => c.path)).toContain('allowedOrigins');
  });

  it('refuses an origin with a path, too many origins, and an empty list for a live widget, changing nothing', async () => {
    const url = `/orgs/${org.id}/widgets/${widget.id}/origins`;
    const before = await snapshotTables(t.db.sequelize);
    const withPath = await developer.put(url, { origins: [`${SITE}/contact`] }).expect(400);
    expect(fieldsOf(withPath.body)).toEqual(['body.origins.0']);
    const many = Array.from({ length: 21 }, (_, i) => `https://site${i}.marlpit-damp.example`);
    expect(fieldsOf((await developer.put(url, { origins: many }).expect(400)).body)).toEqual([
      'body.origins',
    ]);
    expect(fieldsOf((await developer.put(url, { origins: [] }).expect(400)).body)).toEqual(['body.origins']);
    await analyst.put(url, { origins: [SITE] }).expect(403);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });
});
