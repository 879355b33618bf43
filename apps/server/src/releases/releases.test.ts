import { QueryTypes } from 'sequelize';
import { createHash, randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { calculate as calculateFn } from '@wickstone/calc-core';
import {
  auditResponseSchema,
  errorBodySchema,
  releaseListSchema,
  releaseManifestSchema,
  upgradePreviewSchema,
  verifyResponseSchema,
  widgetSchema,
  type Widget,
} from '@wickstone/contracts';
import {
  createLiveWidget,
  createTestApp,
  seedOrgWithTeam,
  snapshotTables,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { publishTestReleases, type TestReleases } from '../../testing/releases.js';
import { reportOf } from '../runs/invent.js';
import { Run } from '../db/models/index.js';

const SITE = 'https://www.ferrowick-survey.example';
const fieldsOf = (body: unknown) =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string }[] }).fields.map((f) => f.field);
const nodeRequire = createRequire(import.meta.url);

describe('releases side by side, and pins', () => {
  let rel: TestReleases;
  let t: TestApp;
  let org: FixtureOrg;
  let owner: TestClient;
  let developer: TestClient;
  let analyst: TestClient;
  let widget: Widget;
  const engineOf = (version: string) =>
    nodeRequire(path.join(rel.dir, version, 'engine.mjs')) as { calculate: typeof calculateFn; VERSION: string };
  const manifestOf = (version: string) =>
    releaseManifestSchema.parse(JSON.parse(readFileSync(path.join(rel.dir, version, 'manifest.json'), 'utf8')));
  // A contact angle below 90° and a narrow bore: the newer engine's meniscus change shows here.
  const inputs = { diameter: 0.0008, liquid: 'water', contactAnglePreset: 'custom', contactAngleDeg: 20 };
  const report = (body: unknown) =>
    request(t.app)
      .post('/api/v1/embed/runs')
      .set('Origin', SITE)
      .set('Content-Type', 'text/plain;charset=UTF-8')
      .send(JSON.stringify(body));
  /** A run as the widget of `release` reports it: computed by that release's own engine. */
  const runBy = (release: string, claimed: string | undefined = release) => {
    const r = engineOf(release).calculate('tube-rise', inputs);
    return {
      ...reportOf(r, { id: randomUUID(), publicKey: widget.publicKey, unitSystem: 'si' }),
      ...(claimed === undefined ? {} : { release: claimed }),
    };
  };

  beforeAll(async () => {
    rel = await publishTestReleases();
    t = await createTestApp({ PUBLISHED_RELEASES_DIR: rel.dir });
    org = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    developer = new TestClient(t.app);
    analyst = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    await developer.login(org.users.developer.email, org.users.developer.password);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    widget = await createLiveWidget(owner, org.id, 'Cellar wall check', [SITE]);
    // A widget made before reference keys: its older key is one 0.1.0's loader reads too (a
    // reference key could not be pinned there).
    const olderKey = 'wk_cellarwallcheck00001';
    await t.db.sequelize.query('UPDATE widgets SET public_key = ? WHERE id = ?', {
      replacements: [olderKey, widget.id],
      type: QueryTypes.UPDATE,
    });
    widget = { ...widget, publicKey: olderKey };
  }, 300_000);
  afterAll(async () => {
    await t?.close();
    rel?.cleanup();
  });

  it('the two engines really differ, on tube-rise riseCorrected only', () => {
    const a = engineOf(rel.older).calculate('tube-rise', inputs);
    const b = engineOf(rel.newer).calculate('tube-rise', inputs);
    expect(a.outputs.rise).toBe(b.outputs.rise);
    expect(b.outputs.riseCorrected).not.toBe(a.outputs.riseCorrected);
  });

  it('lists every release newest first, with its engine version and changelog, to any member', async () => {
    const list = releaseListSchema.parse((await analyst.get('/releases').expect(200)).body);
    const published = list.items.filter((r) => r.published).map((r) => r.version);
    expect(published).toEqual([rel.newer, rel.older]);
    const newer = list.items.find((r) => r.version === rel.newer);
    expect(newer?.engineVersion).toBe(engineOf(rel.newer).VERSION);
    expect(newer?.changelog.map((c) => c.id)).toEqual(['meniscus-volume']);
    // 0.1.0's changelog is the Changesets entries it was published with: none of them again in 0.2.0.
    expect(list.items.find((r) => r.version === rel.older)?.changelog.length).toBeGreaterThan(0);
    await request(t.app).get('/api/v1/releases').expect(401);
  });

  it('a widget pinned to the older release gets its script and SRI, still served after the newer one exists', async () => {
    expect(widget.release).toBe(rel.newer);
    const res = await developer.put(`/orgs/${org.id}/widgets/${widget.id}/release`, { pin: rel.older }).expect(200);
    const pinned = widgetSchema.parse(res.body);
    expect(pinned.release).toBe(rel.older);
    expect(pinned.releasePin).toBe(rel.older);
    const older = manifestOf(rel.older);
    expect(pinned.embed.integrity).toBe(older.files['tube-rise']?.integrity);
    expect(pinned.embed.scriptUrl).toMatch(/\/releases\/0\.1\.0\/wickstone-tube-rise\.js$/);
    expect(pinned.embed.snippet).toContain(`integrity="${older.files['tube-rise']?.integrity}"`);
    // The served bytes are the ones the SRI hash names.
    const script = await request(t.app)
      .get(new URL(pinned.embed.scriptUrl).pathname)
      .set('Accept-Encoding', 'identity')
      .buffer(true)
      .parse((r, cb) => {
        const parts: Buffer[] = [];
        r.on('data', (c: Buffer) => parts.push(c));
        r.on('end', () => cb(null, Buffer.concat(parts)));
      })
      .expect(200);
    const sri = `sha384-${createHash('sha384').update(script.body as Buffer).digest('base64')}`;
    expect(sri).toBe(pinned.embed.integrity);
    const read = widgetSchema.parse((await analyst.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body);
    expect(read.releasePin).toBe(rel.older);
    // Audited, with who and what.
    const audit = auditResponseSchema.parse((await owner.get(`/orgs/${org.id}/audit`).expect(200)).body);
    const entry = audit.items.find((e) => e.type === 'widget.release_pinned');
    expect(entry?.details).toMatchObject({ pin: rel.older, release: { from: rel.newer, to: rel.older } });
  });

  it('recomputes a run with the engine of the release that made it', async () => {
    const older = runBy(rel.older);
    expect((await report(older).expect(201)).body).toMatchObject({ agreed: true });
    const newer = runBy(rel.newer);
    // A page still on the newer script while the widget is pinned back: its engine, not the pin's.
    expect((await report(newer).expect(201)).body).toMatchObject({ agreed: true });
    // The newer engine's figures claimed as the older release's: the older engine disagrees.
    const wrong = runBy(rel.newer, rel.older);
    expect((await report(wrong).expect(201)).body).toMatchObject({ agreed: false });
    const stored = await Run.findByPk(newer.id);
    expect(stored?.release).toBe(rel.newer);
    // A report without a release is taken as made by the widget's release (the pin).
    expect((await report(runBy(rel.older, undefined)).expect(201)).body).toMatchObject({ agreed: true });
    // The public verification re-runs with the run's own engine: both agree.
    for (const id of [older.id, newer.id]) {
      const v = verifyResponseSchema.parse((await request(t.app).get(`/api/v1/verify/${id}`).expect(200)).body);
      expect(v.agrees).toBe(true);
    }
  });

  it('refuses a run from a release the server does not have, naming the field, storing nothing', async () => {
    const before = await snapshotTables(t.db.sequelize);
    const res = await report(runBy(rel.older, '0.9.9')).expect(400);
    expect(fieldsOf(res.body)).toEqual(['body.release']);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });

  it('previews an upgrade over the widget’s logged runs: the runs the newer engine changes, by how much', async () => {
    // Two more runs the change moves (a contact angle below 90°) and two it cannot (90°: no meniscus).
    const extra = [
      { ...inputs, diameter: 0.0003 },
      { ...inputs, diameter: 0.0015, contactAngleDeg: 5 },
      { ...inputs, contactAngleDeg: 90 },
      { ...inputs, diameter: 0.002, contactAngleDeg: 90 },
    ];
    for (const x of extra) {
      const r = engineOf(rel.older).calculate('tube-rise', x);
      const body = { ...reportOf(r, { id: randomUUID(), publicKey: widget.publicKey, unitSystem: 'si' }), release: rel.older };
      await report(body).expect(201);
    }
    const url = `/orgs/${org.id}/widgets/${widget.id}/upgrade-preview?to=${rel.newer}`;
    const preview = upgradePreviewSchema.parse((await developer.get(url).expect(200)).body);
    expect(preview.from).toEqual({ version: rel.older, engineVersion: engineOf(rel.older).VERSION });
    expect(preview.to.version).toBe(rel.newer);
    const stored = await Run.findAll({ where: { widgetId: widget.id } });
    expect(preview.runs).toBe(stored.length);
    // Expected from the two engines themselves, run by run.
    const moves = stored.map((run) => {
      const a = engineOf(rel.older).calculate('tube-rise', run.inputs).outputs.riseCorrected as number;
      const b = engineOf(rel.newer).calculate('tube-rise', run.inputs).outputs.riseCorrected as number;
      return { id: run.id, rel: Math.abs(b - a) / Math.abs(a), angle: run.inputs.contactAngleDeg };
    });
    const changed = moves.filter((m) => m.rel > 1e-9);
    expect(changed.every((m) => Number(m.angle) < 90)).toBe(true);
    expect(changed.length).toBe(stored.length - 2);
    expect(preview.runsChanged).toBe(changed.length);
    expect(preview.outputs.map((o) => o.id)).toEqual(['riseCorrected']);
    expect(preview.outputs[0]?.runsChanged).toBe(changed.length);
    expect(preview.outputs[0]?.largestRelativeChange).toBeCloseTo(Math.max(...changed.map((m) => m.rel)), 12);
    expect(new Set(preview.topRuns.map((r) => r.runId))).toEqual(new Set(changed.map((m) => m.id)));
    expect(preview.topRuns[0]?.largestRelativeChange).toBe(preview.outputs[0]?.largestRelativeChange);
    expect(preview.refused).toBe(0);
    // The older engine's answers are the ones it recorded at ingest; the run the newer release made
    // (its stored result is the newer engine's) is run again with the older engine.
    const otherRelease = stored.filter((r) => r.release !== rel.older).length;
    expect(otherRelease).toBeGreaterThan(0);
    expect(preview.fromSide).toEqual({ recorded: stored.length - otherRelease, rerun: otherRelease });
    expect(preview.note).toMatch(/^The current engine's answers are the ones recorded/);
    // The same release changes nothing; an unknown one is a 400 naming the query; the analyst may not look.
    const none = upgradePreviewSchema.parse(
      (await developer.get(`/orgs/${org.id}/widgets/${widget.id}/upgrade-preview?to=${rel.older}`).expect(200)).body,
    );
    expect(none.runsChanged).toBe(0);
    expect(none.topRuns).toEqual([]);
    const bad = await developer.get(`/orgs/${org.id}/widgets/${widget.id}/upgrade-preview?to=0.9.9`).expect(400);
    expect(fieldsOf(bad.body)).toEqual(['query.to']);
    await analyst.get(url).expect(403);
  });

  it('moving the pin to a minor line changes the snippet; the old files stay served', async () => {
    const before = widgetSchema.parse((await developer.get(`/orgs/${org.id}/widgets/${widget.id}`).expect(200)).body);
    const line = `~${rel.newer.split('.').slice(0, 2).join('.')}`;
    const moved = widgetSchema.parse(
      (await developer.put(`/orgs/${org.id}/widgets/${widget.id}/release`, { pin: line }).expect(200)).body,
    );
    expect(moved.release).toBe(rel.newer);
    expect(moved.releasePin).toBe(line);
    expect(moved.embed.snippet).not.toBe(before.embed.snippet);
    expect(moved.embed.integrity).toBe((manifestOf(rel.newer)).files['tube-rise']?.integrity);
    await request(t.app).get(new URL(before.embed.scriptUrl).pathname).expect(200);
  });

  it('refuses an unknown version, a malformed or empty line, naming body.pin and changing nothing; the analyst may not pin', async () => {
    const url = `/orgs/${org.id}/widgets/${widget.id}/release`;
    const before = await snapshotTables(t.db.sequelize);
    for (const pin of ['0.9.9', '~0.9', '^0.2', 'latest', '0.2', '']) {
      const res = await developer.put(url, { pin }).expect(400);
      expect(fieldsOf(res.body), pin).toEqual(['body.pin']);
    }
    await analyst.put(url, { pin: rel.older }).expect(403);
    expect(await snapshotTables(t.db.sequelize)).toEqual(before);
  });
});
