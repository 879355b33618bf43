import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  defaultWidgetSettings,
  errorBodySchema,
  isReferenceKey,
  widgetSchema,
  type Widget,
} from '@wickstone/contracts';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { makePng } from '../../testing/images.js';
import { WidgetRevision } from '../db/models/index.js';

const fieldsOf = (body: unknown) =>
  (errorBodySchema.parse(body).error.details as { fields: { field: string; message: string }[] }).fields;

describe('widgets API', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let other: FixtureOrg;
  let owner: TestClient;
  let analyst: TestClient;
  let outsider: TestClient;

  beforeAll(async () => {
    t = await createTestApp();
    org = await seedOrgWithTeam();
    other = await seedOrgWithTeam();
    owner = new TestClient(t.app);
    analyst = new TestClient(t.app);
    outsider = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    await outsider.login(other.users.owner.email, other.users.owner.password);
  });
  afterAll(() => t.close());

  const create = async (name = 'Damp-proofing check') =>
    widgetSchema.parse(
      (await owner.post(`/orgs/${org.id}/widgets`, { name, calculatorId: 'tube-rise' }).expect(201)).body,
    );

  it('creates a draft widget with a public key and the embed snippet of the current release', async () => {
    const w = await create();
    expect(w).toMatchObject({
      name: 'Damp-proofing check',
      calculatorId: 'tube-rise',
      status: 'draft',
      allowedOrigins: [],
    });
    expect(isReferenceKey(w.publicKey)).toBe(true);
    expect(w.settings).toEqual(defaultWidgetSettings());
    expect(w.embed.snippet).toContain(`data-wickstone-key="${w.publicKey}"`);
    // A placeholder before the script holds the widget's place: tube-rise shows five inputs by default
    // (liquid, temperature, contact angle preset, bore, gravity), each a row at a phone's width.
    const held =
      /^<wickstone-widget data-calculator="tube-rise" style="display:block;min-height:(\d+)px;--wk-held:\1px"><\/wickstone-widget>\n<script /.exec(
        w.embed.snippet,
      );
    expect(held).not.toBeNull();
    expect(Number(held?.[1])).toBe(440 + 100 * 5 + 100);
    expect(w.embed.integrity).toMatch(/^sha384-[A-Za-z0-9+/]+=*$/);
    expect(w.embed.scriptUrl).toMatch(
      new RegExp(`/releases/${w.release.replace(/\./g, '\\.')}/wickstone-tube-rise\\.js$`),
    );
    const list = (await analyst.get(`/orgs/${org.id}/widgets`).expect(200)).body as {
      items: Widget[];
      total: number;
    };
    expect(list.items.map((x) => x.id)).toContain(w.id);
  });

  it('refuses an unknown calculator and unknown or out-of-range input settings, naming the field', async () => {
    const r1 = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'no-such' })
      .expect(400);
    expect(fieldsOf(r1.body)).toEqual([{ field: 'body.calculatorId', message: 'No calculator "no-such"' }]);
    const settings = defaultWidgetSettings();
    settings.inputs = { boreSize: { mode: 'locked', default: 1 } };
    const r2 = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
      .expect(400);
    expect(fieldsOf(r2.body).map((f) => f.field)).toEqual(['body.settings.inputs.boreSize']);
    settings.inputs = { diameter: { mode: 'locked', default: -1 } };
    const r3 = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
      .expect(400);
    expect(fieldsOf(r3.body).map((f) => f.field)).toEqual(['body.settings.inputs.diameter.default']);
  });

  it('limits a choice to the options the firm offers, refusing ones the calculator lacks or a default left out', async () => {
    const settings = defaultWidgetSettings();
    settings.inputs = { contactAnglePreset: { mode: 'editable', options: ['water-clean-glass', 'no-such'] } };
    const bad = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
      .expect(400);
    expect(fieldsOf(bad.body).map((f) => f.field)).toEqual([
      'body.settings.inputs.contactAnglePreset.options.1',
    ]);
    settings.inputs = { contactAnglePreset: { mode: 'editable', options: ['custom'] } };
    const left = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
      .expect(400);
    // The calculator's default preset (water on clean glass) is not offered: the form could not start.
    expect(fieldsOf(left.body).map((f) => f.field)).toEqual([
      'body.settings.inputs.contactAnglePreset.options',
    ]);
    settings.inputs = { diameter: { mode: 'editable', options: ['x'] } };
    const notChoice = await owner
      .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
      .expect(400);
    expect(fieldsOf(notChoice.body).map((f) => f.field)).toEqual(['body.settings.inputs.diameter.options']);
    settings.inputs = { contactAnglePreset: { mode: 'editable', default: 'custom', options: ['custom'] } };
    settings.result = { secondary: 'hidden' };
    const ok = widgetSchema.parse(
      (
        await owner
          .post(`/orgs/${org.id}/widgets`, { name: 'x', calculatorId: 'tube-rise', settings })
          .expect(201)
      ).body,
    );
    expect(ok.settings.inputs.contactAnglePreset?.options).toEqual(['custom']);
    expect(ok.settings.result).toEqual({ secondary: 'hidden' });
  });

  it('refuses colours that fail WCAG AA with the ratio, and keeps what was stored', async () => {
    const w = await create('Contrast');
    const settings = structuredClone(w.settings);
    settings.look.colors.text = '#bbbbbb';
    const res = await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { settings }).expect(400);
    const [issue] = fieldsOf(res.body);
    expect(issue?.field).toBe('body.settings.look.colors.text');
    expect(issue?.message).toMatch(
      /Contrast between text and background is 1\.9\d:1; WCAG AA needs at least 4\.5:1/,
    );
    const again = widgetSchema.parse((await owner.get(`/orgs/${org.id}/widgets/${w.id}`).expect(200)).body);
    expect(again.settings.look.colors.text).toBe(w.settings.look.colors.text);
  });

  it('validates origins and needs one before going live', async () => {
    const w = await create('Origins');
    const bad = await owner
      .patch(`/orgs/${org.id}/widgets/${w.id}`, { allowedOrigins: ['https://site.example/path'] })
      .expect(400);
    expect(fieldsOf(bad.body)[0]?.field).toBe('body.allowedOrigins.0');
    const live = await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { status: 'live' }).expect(400);
    expect(fieldsOf(live.body)[0]?.field).toBe('body.allowedOrigins');
    const ok = await owner
      .patch(`/orgs/${org.id}/widgets/${w.id}`, {
        status: 'live',
        allowedOrigins: ['HTTPS://www.Brackenridge-Ground.example'],
      })
      .expect(200);
    expect(widgetSchema.parse(ok.body)).toMatchObject({
      status: 'live',
      allowedOrigins: ['https://www.brackenridge-ground.example'],
    });
  });

  it('keeps every save as a revision: who, when and what changed', async () => {
    const w = await create('Revisions');
    const settings = structuredClone(w.settings);
    settings.cautions = 'Readings on site govern.';
    settings.look.corner = 'round';
    await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { name: 'Revisions 2', settings }).expect(200);
    await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { name: 'Revisions 2', settings }).expect(200); // no change: no revision
    const res = await analyst.get(`/orgs/${org.id}/widgets/${w.id}/revisions`).expect(200);
    const { items, total } = res.body as {
      items: { author: { name: string }; changes: { path: string; before: unknown; after: unknown }[] }[];
      total: number;
    };
    expect(total).toBe(2);
    expect(items[0]?.author.name).toBe(org.users.owner.name);
    expect(items[0]?.changes).toEqual([
      { path: 'name', before: 'Revisions', after: 'Revisions 2' },
      { path: 'settings.cautions', before: '', after: 'Readings on site govern.' },
      { path: 'settings.look.corner', before: 'soft', after: 'round' },
    ]);
    expect(await WidgetRevision.count({ where: { widgetId: w.id } })).toBe(2);
  });

  it('restores the name, sites and settings of an earlier revision as a new, audited save, keeping the status', async () => {
    const w = await create('Restorable');
    const settings = structuredClone(w.settings);
    settings.cautions = 'Readings on site govern.';
    await owner
      .patch(`/orgs/${org.id}/widgets/${w.id}`, {
        name: 'Restorable, changed',
        settings,
        allowedOrigins: ['https://www.restore.example'],
        status: 'live',
      })
      .expect(200);
    const revisions = (await analyst.get(`/orgs/${org.id}/widgets/${w.id}/revisions`).expect(200)).body as {
      items: { id: number }[];
    };
    const first = revisions.items.at(-1)!.id;
    // Analysts may read the history but not restore from it; another firm cannot reach it at all.
    await analyst.post(`/orgs/${org.id}/widgets/${w.id}/revisions/${first}/restore`).expect(403);
    await outsider.post(`/orgs/${other.id}/widgets/${w.id}/revisions/${first}/restore`).expect(404);
    const otherWidget = await create('Someone else');
    await owner.post(`/orgs/${org.id}/widgets/${otherWidget.id}/revisions/${first}/restore`).expect(404);

    // Going back to the first revision would leave a widget in service with no site: refused, nothing changes.
    const refused = await owner
      .post(`/orgs/${org.id}/widgets/${w.id}/revisions/${first}/restore`)
      .expect(400);
    expect(fieldsOf(refused.body).map((f) => f.field)).toEqual(['body.allowedOrigins']);
    expect(await WidgetRevision.count({ where: { widgetId: w.id } })).toBe(2);
    await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { status: 'paused' }).expect(200);

    const restored = widgetSchema.parse(
      (await owner.post(`/orgs/${org.id}/widgets/${w.id}/revisions/${first}/restore`).expect(200)).body,
    );
    expect(restored).toMatchObject({ name: 'Restorable', status: 'paused', allowedOrigins: [] });
    expect(restored.settings).toEqual(w.settings);
    const latest = (await analyst.get(`/orgs/${org.id}/widgets/${w.id}/revisions`).expect(200)).body as {
      items: { changes: { path: string; before: unknown; after: unknown }[] }[];
      total: number;
    };
    expect(latest.total).toBe(4);
    expect(latest.items[0]?.changes).toContainEqual({
      path: 'settings.cautions',
      before: 'Readings on site govern.',
      after: '',
    });
    const audit = (await owner.get(`/orgs/${org.id}/audit`).expect(200)).body as {
      items: { type: string; details: Record<string, unknown> }[];
    };
    expect(audit.items.find((e) => e.type === 'widget.updated' && e.details.restoredRevision)).toMatchObject({
      details: { widgetId: w.id, restoredRevision: first },
    });
  });

  it('lets analysts read but not change, and hides widgets from other organisations', async () => {
    const w = await create('Scoped');
    await analyst.patch(`/orgs/${org.id}/widgets/${w.id}`, { name: 'nope' }).expect(403);
    await outsider.get(`/orgs/${org.id}/widgets/${w.id}`).expect(404);
    await outsider.get(`/orgs/${other.id}/widgets/${w.id}`).expect(404);
    await outsider.patch(`/orgs/${other.id}/widgets/${w.id}`, { name: 'stolen' }).expect(404);
    const again = widgetSchema.parse((await owner.get(`/orgs/${org.id}/widgets/${w.id}`).expect(200)).body);
    expect(again.name).toBe('Scoped');
  });

  describe('logo upload', () => {
    const upload = (client: TestClient, orgId: number, data: Buffer, filename: string, contentType: string) =>
      client
        .csrf()
        .then((token) =>
          client.agent
            .post(`/api/v1/orgs/${orgId}/assets`)
            .set('x-csrf-token', token)
            .attach('file', data, { filename, contentType }),
        );

    it('stores a PNG checked by content and lets a widget use it', async () => {
      const res = await upload(owner, org.id, makePng(64, 32), 'logo.png', 'image/png');
      expect(res.status).toBe(201);
      expect(res.body).toMatchObject({ contentType: 'image/png', width: 64, height: 32 });
      const w = await create('With logo');
      const settings = structuredClone(w.settings);
      settings.look.logoAssetId = res.body.id as number;
      const saved = widgetSchema.parse(
        (await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { settings }).expect(200)).body,
      );
      expect(saved.logoUrl).toMatch(/\/api\/v1\/embed\/assets\/\d+\/[0-9a-f]{16}$/);
      const img = await fetchFromApp(saved.logoUrl as string);
      expect(img.status).toBe(200);
      expect(img.headers['content-type']).toBe('image/png');
      expect(img.headers['content-security-policy']).toBe("default-src 'none'");
    });

    it('refuses a script renamed .png, an SVG and an oversized image', async () => {
      const script = await upload(
        owner,
        org.id,
        Buffer.from('alert(document.cookie)'),
        'logo.png',
        'image/png',
      );
      expect(script.status).toBe(400);
      expect(fieldsOf(script.body)[0]?.field).toBe('file');
      const svg = await upload(
        owner,
        org.id,
        Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
        'logo.svg',
        'image/svg+xml',
      );
      expect(svg.status).toBe(400);
      const big = await upload(
        owner,
        org.id,
        Buffer.concat([makePng(8, 8), Buffer.alloc(600 * 1024)]),
        'big.png',
        'image/png',
      );
      expect(big.status).toBe(413);
      expect(fieldsOf(big.body)[0]?.field).toBe('file');
    });

    it('will not let a widget use another organisation’s image', async () => {
      const theirs = await upload(outsider, other.id, makePng(10, 10), 'theirs.png', 'image/png');
      expect(theirs.status).toBe(201);
      const w = await create('Borrowed logo');
      const settings = structuredClone(w.settings);
      settings.look.logoAssetId = theirs.body.id as number;
      const res = await owner.patch(`/orgs/${org.id}/widgets/${w.id}`, { settings }).expect(400);
      expect(fieldsOf(res.body)[0]?.field).toBe('body.settings.look.logoAssetId');
    });
  });

  function fetchFromApp(url: string) {
    return owner.agent.get(new URL(url).pathname);
  }
});
