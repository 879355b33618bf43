import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { runDetailSchema, runListResponseSchema, type RunListItem } from '@wickstone/contracts';
import {
  createTestApp,
  seedOrgWithTeam,
  TestClient,
  type FixtureOrg,
  type TestApp,
} from '../../testing/index.js';
import { UTF8_BOM } from '../export/csv.js';
import { readCsv } from '../../testing/csv.js';
import {
  fieldsOf,
  liveWidget,
  PORTAL,
  reportRun,
  requestAssessment,
  runAt,
  SITE,
  store,
  type FixtureWidget,
} from '../../testing/usage.js';
import { EXPORT_CHUNK } from './service.js';

/*
 * The runs table over a fixture whose every run is placed by hand: filters, day edges, paging,
 * sort, what each row shows, one run's page, and the CSV export (streamed in keyset chunks).
 */
describe('runs', () => {
  let t: TestApp;
  let org: FixtureOrg;
  let other: FixtureOrg;
  let owner: TestClient;
  let analyst: TestClient;
  let developer: TestClient;
  let tube: FixtureWidget;
  let soil: FixtureWidget;
  let odd: FixtureWidget;
  let otherWidget: FixtureWidget;
  const ids: Record<string, string> = {};
  let leadRunId: string;

  const list = async (client: TestClient, query: string) =>
    runListResponseSchema.parse((await client.get(`/orgs/${org.id}/runs?${query}`).expect(200)).body);

  /** What the same filters select from the raw table, newest first: the answer the API must match. */
  async function rawIds(where: string, params: unknown[] = []): Promise<string[]> {
    const rows = await t.db.sequelize.query<{ id: string }>(
      `SELECT id FROM runs WHERE organization_id = ? ${where ? `AND ${where}` : ''} ORDER BY created_at DESC, id DESC`,
      { replacements: [org.id, ...params], type: QueryTypes.SELECT },
    );
    return rows.map((r) => r.id);
  }

  beforeAll(async () => {
    t = await createTestApp({ LEAD_LIMIT_PER_IP: '1000' });
    org = await seedOrgWithTeam('Brackenridge Ground & Damp');
    other = await seedOrgWithTeam('Fenwick Clay Testing');
    owner = new TestClient(t.app);
    await owner.login(org.users.owner.email, org.users.owner.password);
    analyst = new TestClient(t.app);
    await analyst.login(org.users.analyst.email, org.users.analyst.password);
    developer = new TestClient(t.app);
    await developer.login(org.users.developer.email, org.users.developer.password);
    tube = await liveWidget(owner, org.id, 'Rising damp in a pore', 'tube-rise', [SITE, PORTAL], (s) => ({
      ...s,
      inputs: { gravity: { mode: 'hidden' }, liquid: { mode: 'locked', default: 'water' } },
    }));
    soil = await liveWidget(owner, org.id, 'Slab check', 'soil-capillary-rise', [SITE], (s) => ({
      ...s,
      units: { system: 'us', visitorMaySwitch: true },
    }));
    odd = await liveWidget(owner, org.id, '@risk, "quoted" widget', 'slot-rise');
    const otherOwner = new TestClient(t.app);
    await otherOwner.login(other.users.owner.email, other.users.owner.password);
    otherWidget = await liveWidget(otherOwner, other.id, 'Fenwick tube', 'tube-rise');

    const named = [
      runAt(tube, '2026-01-10T08:00:00.000Z', { diameter: 0.0008 }),
      runAt(tube, '2026-01-10T09:00:00.000Z', { diameter: 0.004 }, { origin: PORTAL }),
      runAt(tube, '2026-01-11T23:59:59.999Z', { diameter: 0.001 }, { agreed: false }),
      runAt(soil, '2026-01-12T00:00:00.000Z', { d10: 0.0001, waterTableDepth: 1 }, { unitSystem: 'si' }),
      runAt(soil, '2026-01-15T12:00:00.000Z', { d10: 0.00002, waterTableDepth: 0.5 }),
      runAt(odd, '2026-01-16T12:00:00.000Z', { gap: 0.01 }),
    ];
    ['jan10a', 'jan10b', 'jan11', 'jan12', 'jan15', 'jan16'].forEach((k, i) => (ids[k] = named[i]!.id));
    // 125 runs across February for paging; the last 40 share one instant, so only the id orders them.
    const feb = Array.from({ length: 125 }, (_, i) =>
      runAt(
        tube,
        i < 85
          ? `2026-02-${String(1 + (i % 28)).padStart(2, '0')}T10:${String(i % 60).padStart(2, '0')}:00.000Z`
          : '2026-02-20T10:00:00.000Z',
        {
          diameter: i % 5 === 0 ? 0.004 : 0.0008,
        },
      ),
    );
    await store(t.db.sequelize, [...named, ...feb]);
    await store(t.db.sequelize, [runAt(otherWidget, '2026-01-10T08:30:00.000Z', { diameter: 0.0008 })]);
    // And one through the embed API, today, with a request for an assessment.
    leadRunId = await reportRun(t.app, tube, { diameter: 0.0005 });
    await requestAssessment(t.app, tube, leadRunId, {
      name: 'Hester Quayle',
      email: 'hester.quayle@mail.example',
    });
  });
  afterAll(() => t.close());

  describe('filters', () => {
    it('lists every run of the organisation, newest first, and none of another', async () => {
      const all = await list(analyst, 'pageSize=200');
      expect(all.total).toBe(6 + 125 + 1);
      expect(all.items.map((r) => r.id)).toEqual(await rawIds(''));
      const times = all.items.map((r) => r.createdAt);
      expect([...times].sort().reverse()).toEqual(times);
    });

    it('takes from and to as whole UTC days, both included', async () => {
      const r = await list(analyst, 'from=2026-01-10&to=2026-01-11');
      expect(r.items.map((x) => x.id).sort()).toEqual([ids.jan10a, ids.jan10b, ids.jan11].sort());
      expect(r.total).toBe(3);
      expect((await list(analyst, 'from=2026-01-12&to=2026-01-12')).items.map((x) => x.id)).toEqual([
        ids.jan12,
      ]);
      expect((await list(analyst, 'to=2026-01-09')).total).toBe(0);
    });

    it('filters by widget, calculator, site, warnings and agreement', async () => {
      expect((await list(analyst, `widgetId=${soil.id}`)).items.map((x) => x.id)).toEqual([
        ids.jan15,
        ids.jan12,
      ]);
      expect((await list(analyst, 'calculatorId=slot-rise')).items.map((x) => x.id)).toEqual([ids.jan16]);
      expect((await list(analyst, `origin=${encodeURIComponent(PORTAL)}`)).items.map((x) => x.id)).toEqual([
        ids.jan10b,
      ]);
      expect((await list(analyst, 'agreed=false')).items.map((x) => x.id)).toEqual([ids.jan11]);
      const warned = await list(analyst, 'hasWarning=true&to=2026-01-31');
      expect(warned.items.map((x) => x.id)).toEqual([ids.jan16, ids.jan15, ids.jan10b]);
      expect(warned.items.every((x) => x.warningCodes.length > 0)).toBe(true);
      expect((await list(analyst, 'hasWarning=false&to=2026-01-31')).total).toBe(3);
    });

    it('answers every combination of filters with the rows and total a plain query over the raw runs gives', async () => {
      const combos: [string, string, unknown[]][] = [
        [
          `widgetId=${tube.id}&hasWarning=true&from=2026-02-01&to=2026-02-28`,
          'widget_id = ? AND has_warning = 1 AND created_at >= ? AND created_at < ?',
          [tube.id, '2026-02-01', '2026-03-01'],
        ],
        [
          `widgetId=${tube.id}&hasWarning=false&agreed=true`,
          'widget_id = ? AND has_warning = 0 AND agreed = 1',
          [tube.id],
        ],
        ['hasWarning=false&agreed=false', 'has_warning = 0 AND agreed = 0', []],
        ['hasWarning=true&agreed=true', 'has_warning = 1 AND agreed = 1', []],
        ['agreed=true&calculatorId=tube-rise', "agreed = 1 AND calculator_id = 'tube-rise'", []],
        [
          `origin=${encodeURIComponent(SITE)}&from=2026-01-11`,
          'origin = ? AND created_at >= ?',
          [SITE, '2026-01-11'],
        ],
        ['hasWarning=true&agreed=false', 'has_warning = 1 AND agreed = 0', []],
      ];
      for (const [query, where, params] of combos) {
        const want = await rawIds(where, params);
        const got = await list(analyst, `${query}&pageSize=200`);
        expect(got.total, query).toBe(want.length);
        expect(
          got.items.map((x) => x.id),
          query,
        ).toEqual(want);
      }
    });

    it('names a bad filter and refuses a range that ends before it starts', async () => {
      for (const [query, field] of [
        ['from=2026-13-01', 'query.from'],
        ['from=2026-02-01&to=2026-01-01', 'query.to'],
        ['widgetId=abc', 'query.widgetId'],
        ['origin=not-an-origin', 'query.origin'],
        ['hasWarning=maybe', 'query.hasWarning'],
        ['sort=origin', 'query.sort'],
        ['colour=blue', 'query.colour'],
      ]) {
        const res = await analyst.get(`/orgs/${org.id}/runs?${query}`).expect(400);
        expect(fieldsOf(res.body), query).toEqual([field]);
      }
    });
  });

  describe('paging and sort', () => {
    it('pages through February with the right total, and past the end answers no items with the same total', async () => {
      const q = 'from=2026-02-01&to=2026-02-28&pageSize=50';
      const pages = await Promise.all([1, 2, 3, 4].map((p) => list(analyst, `${q}&page=${p}`)));
      expect(pages.map((p) => p.total)).toEqual([125, 125, 125, 125]);
      expect(pages.map((p) => p.items.length)).toEqual([50, 50, 25, 0]);
      const seen = pages.flatMap((p) => p.items.map((x) => x.id));
      expect(new Set(seen).size).toBe(125);
      expect(seen).toEqual(await rawIds('created_at >= ? AND created_at < ?', ['2026-02-01', '2026-03-01']));
      expect((await list(analyst, `${q}&page=100000`)).items).toEqual([]);
    });

    it('refuses a page size over 200 or under 1 and a page under 1, naming the field', async () => {
      for (const [query, field] of [
        ['pageSize=201', 'query.pageSize'],
        ['pageSize=0', 'query.pageSize'],
        ['page=0', 'query.page'],
        ['page=100001', 'query.page'],
      ]) {
        expect(
          fieldsOf((await analyst.get(`/orgs/${org.id}/runs?${query}`).expect(400)).body),
          query,
        ).toEqual([field]);
      }
      expect((await list(analyst, 'pageSize=200')).items.length).toBe(132);
      expect((await list(analyst, 'pageSize=1&page=132')).items.length).toBe(1);
    });

    it('sorts oldest first on request, with ties broken the same way each time', async () => {
      const asc = await list(analyst, 'sort=createdAt&pageSize=200');
      const desc = await list(analyst, 'sort=-createdAt&pageSize=200');
      expect(asc.items.map((x) => x.id)).toEqual(desc.items.map((x) => x.id).reverse());
      expect(asc.items[0]!.id).toBe(ids.jan10a);
    });
  });

  describe('each row', () => {
    const find = async (id: string, query = 'pageSize=200'): Promise<RunListItem> => {
      const item = (await list(analyst, query)).items.find((x) => x.id === id);
      if (!item) throw new Error(`run ${id} not listed`);
      return item;
    };

    it("shows the key inputs and outputs in the widget's units, not the inputs the firm fixed", async () => {
      const r = await find(ids.jan10a!);
      expect(r.widget).toEqual({ id: tube.id, name: 'Rising damp in a pore' });
      expect(r.calculator).toEqual({ id: 'tube-rise', title: 'Capillary rise or depression in a tube' });
      expect(r.unitSystem).toBe('si');
      const ins = Object.fromEntries(r.inputs.map((v) => [v.id, v]));
      expect(ins.diameter).toMatchObject({ label: 'Bore (inside diameter)', unit: 'mm', text: '0.8 mm' });
      expect(ins.diameter!.value).toBeCloseTo(0.8, 12);
      expect(ins.temperatureC).toMatchObject({ value: 20, unit: '°C' });
      expect(ins.gravity).toBeUndefined();
      expect(ins.liquid).toBeUndefined();
      const rise = r.outputs.find((v) => v.id === 'rise');
      // 4σcosθ/(ρgd) for water at 20 °C in a 0.8 mm bore, as calc-core gave it (37.15 mm), written as the widget writes a result: 37.2 mm.
      expect(rise).toMatchObject({ unit: 'mm', text: '37.2 mm' });
      expect(r).toMatchObject({ origin: SITE, agreed: true, leadId: null, warningCodes: [] });
    });

    it('shows a run of a US widget in the SI units the visitor had switched to, as they saw it', async () => {
      const r = await find(ids.jan12!);
      expect(r.unitSystem).toBe('us');
      expect(r.visitorUnitSystem).toBe('si');
      expect(r.inputs.find((v) => v.id === 'd10')).toMatchObject({ unit: 'mm', text: '0.1 mm' });
      expect(r.outputs.find((v) => v.id === 'capillaryRise')).toMatchObject({ unit: 'm' });
      // The US visitor of the same widget sees inches and feet.
      const us = await find(ids.jan15!);
      expect(us.visitorUnitSystem).toBe('us');
      expect(us.inputs.find((v) => v.id === 'd10')).toMatchObject({ unit: 'in' });
      expect(us.inputs.find((v) => v.id === 'd10')!.value as number).toBeCloseTo(0.00002 / 0.0254, 12);
      expect(us.inputs.find((v) => v.id === 'waterTableDepth')).toMatchObject({ unit: 'ft' });
    });

    it('says which run led to a lead', async () => {
      const r = await find(leadRunId);
      expect(r.leadId).toEqual(expect.any(Number));
      expect(r.pageUrl).toBe(`${SITE}/services/damp-survey`);
    });
  });

  describe('one run', () => {
    it('gives the inputs, the working made again from them, whether the server agreed, and the lead', async () => {
      const d = runDetailSchema.parse(
        (await analyst.get(`/orgs/${org.id}/runs/${leadRunId}`).expect(200)).body,
      );
      const stored = await t.db.sequelize.query<{ server_result: unknown; client_result: unknown }>(
        'SELECT server_result, client_result FROM runs WHERE id = ?',
        {
          replacements: [leadRunId],
          type: QueryTypes.SELECT,
        },
      );
      // The row keeps the figures, not the working; the page has both.
      expect(stored[0]!.server_result).not.toHaveProperty('working');
      expect(d.serverResult).toMatchObject(stored[0]!.server_result as Record<string, unknown>);
      expect(d.clientResult).toEqual(stored[0]!.client_result);
      expect((d.serverResult as { working: unknown[] }).working.length).toBeGreaterThan(0);
      expect(d).toMatchObject({ agreed: true, mismatch: null, sentInputs: { diameter: 0.0005 } });
      expect(d.lead).toMatchObject({ status: 'new', name: 'Hester Quayle', erasedAt: null });
    });

    it('shows where the recomputation disagreed', async () => {
      const d = runDetailSchema.parse(
        (await analyst.get(`/orgs/${org.id}/runs/${ids.jan11}`).expect(200)).body,
      );
      expect(d.agreed).toBe(false);
      expect(d.mismatch).toMatchObject({
        outputs: { rise: { server: expect.any(Number), client: expect.any(Number) } },
      });
    });

    it('does not show a developer who sent the lead, only that there was one', async () => {
      const d = runDetailSchema.parse(
        (await developer.get(`/orgs/${org.id}/runs/${leadRunId}`).expect(200)).body,
      );
      expect(d.leadId).toEqual(expect.any(Number));
      expect(d.lead).toBeNull();
      expect(JSON.stringify(d)).not.toContain('Hester');
    });

    it("answers 404 for an unknown run and for another organisation's", async () => {
      await analyst.get(`/orgs/${org.id}/runs/00000000-0000-4000-8000-000000000000`).expect(404);
      const theirs = (
        await t.db.sequelize.query<{ id: string }>('SELECT id FROM runs WHERE organization_id = ?', {
          replacements: [other.id],
          type: QueryTypes.SELECT,
        })
      )[0]!.id;
      await analyst.get(`/orgs/${org.id}/runs/${theirs}`).expect(404);
      expect(fieldsOf((await analyst.get(`/orgs/${org.id}/runs/not-a-uuid`).expect(400)).body)).toEqual([
        'params.runId',
      ]);
    });
  });

  describe('CSV export', () => {
    it('downloads the filtered runs as an attachment with a header row, one record per run', async () => {
      const res = await analyst.get(`/orgs/${org.id}/runs/export?from=2026-01-01&to=2026-01-31`).expect(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
      expect(res.headers['content-disposition']).toMatch(
        /^attachment; filename="t-[0-9a-f]+-runs-2026-01-01-to-2026-01-31\.csv"$/,
      );
      expect(res.text.startsWith(UTF8_BOM)).toBe(true);
      const [header, ...rows] = readCsv(res.text);
      expect(header).toEqual([
        'Time (UTC)',
        'Run',
        'Widget ID',
        'Widget',
        'Calculator',
        'Inputs',
        'Outputs',
        'Units',
        'Warnings',
        'Site',
        'Page',
        'Release',
        'Agreed',
        'Lead',
      ]);
      expect(rows.map((r) => r[1])).toEqual([
        ids.jan16,
        ids.jan15,
        ids.jan12,
        ids.jan11,
        ids.jan10b,
        ids.jan10a,
      ]);
      const jan10a = rows.find((r) => r[1] === ids.jan10a)!;
      expect(jan10a[0]).toBe('2026-01-10T08:00:00.000Z');
      expect(jan10a[3]).toBe('Rising damp in a pore');
      expect(jan10a[5]).toContain('Bore (inside diameter): 0.8 mm');
      expect(jan10a[6]).toContain('Rise (Jurin');
      expect(jan10a[12]).toBe('yes');
      expect(rows.find((r) => r[1] === ids.jan11)![12]).toBe('no');
    });

    it('quotes a cell with commas and quotes, and guards one a spreadsheet would take for a formula', async () => {
      const res = await analyst.get(`/orgs/${org.id}/runs/export?calculatorId=slot-rise`).expect(200);
      expect(res.text).toContain(`,"'@risk, ""quoted"" widget",`);
      expect(readCsv(res.text)[1]![3]).toBe(`'@risk, "quoted" widget`);
      expect(readCsv(res.text)[1]![8]).toBe('GAP_TOO_WIDE');
    });

    it('streams more than one chunk, each run once, ties on the same instant included', async () => {
      // Enough runs for three chunks, a hundred of them at the very same millisecond.
      const many = Array.from({ length: EXPORT_CHUNK * 2 + 100 }, (_, i) =>
        runAt(
          tube,
          i < 100
            ? '2025-06-01T12:00:00.000Z'
            : new Date(Date.parse('2025-06-02T00:00:00Z') + i * 1000).toISOString(),
          { diameter: 0.0008 },
        ),
      );
      await store(t.db.sequelize, many);
      for (const sort of ['-createdAt', 'createdAt']) {
        const res = await analyst.get(`/orgs/${org.id}/runs/export?to=2025-12-31&sort=${sort}`).expect(200);
        const rows = readCsv(res.text).slice(1);
        expect(rows.length).toBe(many.length);
        expect(new Set(rows.map((r) => r[1])).size).toBe(many.length);
        const want = await rawIds('created_at < ?', ['2026-01-01']);
        expect(rows.map((r) => r[1])).toEqual(sort === '-createdAt' ? want : [...want].reverse());
      }
    });

    it('answers an empty selection with the header row alone, and a bad filter with 400 in JSON', async () => {
      const res = await analyst.get(`/orgs/${org.id}/runs/export?to=2020-01-01`).expect(200);
      expect(readCsv(res.text)).toHaveLength(1);
      const bad = await analyst.get(`/orgs/${org.id}/runs/export?pageSize=10`).expect(400);
      expect(bad.headers['content-type']).toMatch(/application\/json/);
      expect(bad.headers['content-disposition']).toBeUndefined();
      expect(fieldsOf(bad.body)).toEqual(['query.pageSize']);
    });
  });
});
