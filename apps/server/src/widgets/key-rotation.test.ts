import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  auditResponseSchema,
  errorBodySchema,
  isReferenceKey,
  legacyKeyPattern,
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

const SITE = 'https://www.ferncombe-survey.example';
const OTHER = 'https://intranet.ferncombe-survey.example';
const DAY = 86_400_000;
const errorOf = (body: unknown) => errorBodySchema.parse(body).error;
const fieldsOf = (body: unknown) =>
  (errorOf(body).details as { fields: { field: string }[] }).fields.map((f) => f.field);

describe('widget key rotation', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let developer: TestClient;
  let analyst: TestClient;
  let widget: Widget;
  let rotated: Widget;

  const settings = (key: string, origin = SITE) =>
    request(t.app).get(`/api/v1/embed/widgets/${key}`).set('Origin', origin);
  const report = (key: string, origin = SITE) =>
    request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', origin)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(runReportBody(key, { id: randomUUID() })));
  const rotate = (w: Widget, oldKeyValidUntil: unknown, as = developer) =>
    as.post(`/orgs/${org.id}/widgets/${w.id}/key-rotations`, { oldKeyValidUntil });
  const runsOf = async (widgetId: number) =>
    Number(
      (
        await t.db.sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM runs WHERE widget_id = ?', {
          replacements: [widgetId],
          type: QueryTypes.SELECT,
        })
      )[0]?.n,
    );

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    developer = new TestClient(t.app);
    analyst = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    await developer.login(org.users.developer.email, org.users.developer.password);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    widget = await createLiveWidget(owner, org.id, 'Trial pit check', [SITE]);
  });
  afterAll(() => t.close());

  it('gives a new widget on the current release a reference key with a valid check symbol', () => {
    expect(widget.release).toBe('0.3.0');
    expect(isReferenceKey(widget.publicKey)).toBe(true);
    expect(widget.previousKey).toBeNull();
    expect(widget.nextKeyKind).toBe('reference');
  });

  it('refuses a date in the past, not a date, and one more than 90 days ahead, naming the field and changing nothing', async () => {
    const before = await snapshotTables(t.db.sequelize);
    for (const bad of [
      new Date(Date.now() - 60_000).toISOString(),
      '2020-01-01',
      'next Tuesday',
      '2026-13-45',
      '',
      17,
      null,
      new Date(Date.now() + 91 * DAY).toISOString(),
    ]) {
      const res = await rotate(widget, bad).expect(400);
      expect(fieldsOf(res.body), String(bad)).toEqual(['body.oldKeyValidUntil']);
    }
    const extra = await developer
      .post(`/orgs/${org.id}/widgets/${widget.id}/key-rotations`, {
        oldKeyValidUntil: new Date(Date.now() + DAY).toISOString(),
        newKey: 'AAAA-AAAA-AAAA-AAAA-A',
      })
      .expect(400);
    expect(errorOf(extra.body).code).toBe('validation_failed');
    await rotate(widget, new Date(Date.now() + DAY).toISOString(), analyst).expect(403);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
    await settings(widget.publicKey).expect(200);
  });

  it('issues a new key; both are served until the date; the audit names both and the date', async () => {
    const until = new Date(Date.now() + 14 * DAY);
    until.setUTCMilliseconds(0);
    rotated = widgetSchema.parse((await rotate(widget, until.toISOString()).expect(201)).body);
    expect(isReferenceKey(rotated.publicKey)).toBe(true);
    expect(rotated.publicKey).not.toBe(widget.publicKey);
    expect(rotated.previousKey).toMatchObject({
      publicKey: widget.publicKey,
      validUntil: until.toISOString(),
      served: true,
    });
    expect(rotated.embed.snippet).toContain(`data-wickstone-key="${rotated.publicKey}"`);
    expect(rotated.embed.snippet).not.toContain(widget.publicKey);
    // The widget's own resource shows both.
    const again = widgetSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body,
    );
    expect(again.publicKey).toBe(rotated.publicKey);
    expect(again.previousKey?.publicKey).toBe(widget.publicKey);

    // The old snippet's page keeps working: settings (under the new key) and run reports.
    const old = await settings(widget.publicKey).expect(200);
    expect((old.body as { publicKey: string }).publicKey).toBe(rotated.publicKey);
    await settings(rotated.publicKey).expect(200);
    const runsBefore = await runsOf(widget.id);
    await report(widget.publicKey).expect(201);
    await report(rotated.publicKey).expect(201);
    expect(await runsOf(widget.id)).toBe(runsBefore + 2);

    const audit = auditResponseSchema.parse((await owner.get(`/orgs/${org.id}/audit`).expect(200)).body);
    const entry = audit.items.find((e) => e.type === 'widget.key_rotated');
    expect(entry?.actor?.email).toBe(org.users.developer.email);
    expect(entry?.details).toEqual({
      widgetId: widget.id,
      oldKey: widget.publicKey,
      newKey: rotated.publicKey,
      oldKeyValidUntil: until.toISOString(),
    });
  });

  it('refuses a second rotation while the replaced key is still served (409), changing nothing', async () => {
    const before = await snapshotTables(t.db.sequelize);
    const res = await rotate(widget, new Date(Date.now() + DAY).toISOString()).expect(409);
    expect(errorOf(res.body).message).toMatch(/still served until/);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });

  it('counts a refused origin that names the replaced key for its widget', async () => {
    await settings(widget.publicKey, OTHER).expect(403);
    const refused = refusedOriginsSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}/refused-origins`).expect(200)).body,
    );
    expect(refused.items.map((i) => [i.origin, i.refusals])).toEqual([[OTHER, 1]]);
  });

  it('after the date the old key is refused with a 410 saying it was replaced and when; the new key works', async () => {
    await t.db.sequelize.query(
      'UPDATE widgets SET previous_key_valid_until = NOW(3) - INTERVAL 1 SECOND WHERE id = ?',
      { replacements: [widget.id], type: QueryTypes.UPDATE },
    );
    const gone = await settings(widget.publicKey).expect(410);
    const error = errorOf(gone.body);
    expect(error.code).toBe('key_replaced');
    expect(error.message).toMatch(/^This widget key was replaced on \d{4}-\d{2}-\d{2} and was served until /);
    expect(error.details).toMatchObject({ replacedAt: rotated.previousKey?.replacedAt });
    const runsBefore = await runsOf(widget.id);
    expect(errorOf((await report(widget.publicKey).expect(410)).body).code).toBe('key_replaced');
    expect(await runsOf(widget.id)).toBe(runsBefore);
    await settings(rotated.publicKey).expect(200);
    await report(rotated.publicKey).expect(201);
    const shown = widgetSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body,
    );
    expect(shown.previousKey?.served).toBe(false);
    // A key no widget ever had is still plainly unknown.
    await settings('988M-4JNV-N3F4-D01S-E').expect(404);
  });

  it('once the overlap is over, rotates again; a date alone means through that day (UTC)', async () => {
    const day = new Date(Date.now() + 3 * DAY).toISOString().slice(0, 10);
    const next = widgetSchema.parse((await rotate(widget, day).expect(201)).body);
    expect(next.previousKey?.publicKey).toBe(rotated.publicKey);
    expect(next.previousKey?.validUntil).toBe(new Date(Date.parse(`${day}T00:00:00Z`) + DAY).toISOString());
  });

  it('stops serving the replaced key at once when the developer ends the overlap (a leaked key): 410 from then on', async () => {
    const shown = widgetSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body,
    );
    const replaced = shown.previousKey!.publicKey;
    expect(shown.previousKey?.served).toBe(true);
    await settings(replaced).expect(200);
    const end = () => developer.post(`/orgs/${org.id}/widgets/${widget.id}/key-rotations/end-overlap`, {});
    // Only those who manage embedding may, and nothing changes when they may not.
    const before = await snapshotTables(t.db.sequelize);
    await analyst.post(`/orgs/${org.id}/widgets/${widget.id}/key-rotations/end-overlap`, {}).expect(403);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);

    const ended = widgetSchema.parse((await end().expect(200)).body);
    expect(ended.publicKey).toBe(shown.publicKey);
    expect(ended.previousKey).toMatchObject({ publicKey: replaced, served: false });
    expect(Date.parse(ended.previousKey!.validUntil)).toBeLessThan(Date.parse(shown.previousKey!.validUntil));
    expect(errorOf((await settings(replaced).expect(410)).body).code).toBe('key_replaced');
    expect(errorOf((await report(replaced).expect(410)).body).code).toBe('key_replaced');
    await settings(ended.publicKey).expect(200);

    const audit = auditResponseSchema.parse((await owner.get(`/orgs/${org.id}/audit`).expect(200)).body);
    const entry = audit.items.find((e) => e.type === 'widget.key_overlap_ended');
    expect(entry?.actor?.email).toBe(org.users.developer.email);
    expect(entry?.details).toEqual({
      widgetId: widget.id,
      oldKey: replaced,
      plannedUntil: shown.previousKey!.validUntil,
      endedAt: ended.previousKey!.validUntil,
    });
    // Nothing left to stop: a 409 that changes nothing; and the key may be replaced again now.
    const after = await snapshotTables(t.db.sequelize);
    expect(errorOf((await end().expect(409)).body).message).toMatch(/nothing to stop/);
    expect(await snapshotTables(t.db.sequelize)).toEqual(after);
    await rotate(widget, new Date(Date.now() + DAY).toISOString()).expect(201);
  });

  it('keeps a widget on a published release before 0.3.0 on keys its loader reads', async () => {
    const pinned = await createLiveWidget(owner, org.id, 'Older loader', [SITE]);
    // A reference key cannot go onto 0.2.0: its loader would not place the widget.
    const refused = await developer
      .put(`/orgs/${org.id}/widgets/${pinned.id}/release`, { pin: '0.2.0' })
      .expect(400);
    expect(fieldsOf(refused.body)).toEqual(['body.pin']);
    const [issue] = (errorOf(refused.body).details as { fields: { message: string }[] }).fields;
    expect(issue?.message).toContain(pinned.publicKey);

    // A widget already on 0.2.0 with an older key (as made before reference keys) rotates to an older key.
    const legacy = 'wk_ferncombe00000000001';
    await t.db.sequelize.query("UPDATE widgets SET public_key = ?, `release` = '0.2.0' WHERE id = ?", {
      replacements: [legacy, pinned.id],
      type: QueryTypes.UPDATE,
    });
    await settings(legacy).expect(200);
    const before = widgetSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${pinned.id}`).expect(200)).body,
    );
    expect(before.nextKeyKind).toBe('older');
    const next = widgetSchema.parse(
      (await rotate(pinned, new Date(Date.now() + 7 * DAY).toISOString()).expect(201)).body,
    );
    expect(next.publicKey).toMatch(legacyKeyPattern);
    expect(next.publicKey).not.toBe(legacy);
    await settings(legacy).expect(200);
    await settings(next.publicKey).expect(200);
    // Both older keys: the pin may move to 0.1.0 and back to 0.3.0.
    await developer.put(`/orgs/${org.id}/widgets/${pinned.id}/release`, { pin: '0.1.0' }).expect(200);
    await developer.put(`/orgs/${org.id}/widgets/${pinned.id}/release`, { pin: '0.3.0' }).expect(200);
  });
});
