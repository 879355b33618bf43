import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op, type WhereOptions } from 'sequelize';
import { defaultWidgetSettings, runExportQuerySchema, type WidgetSettings } from '@wickstone/contracts';
import { createTestDatabase, type TestDatabase } from '../../testing/index.js';
import { readCsv } from '../../testing/csv.js';
import { runAt, store } from '../../testing/usage.js';
import { Lead, Organization, Run, Widget } from '../db/models/index.js';
import { runPrinter, valuesCell } from '../runs/present.js';
import { createRunService } from '../runs/service.js';
import type { RunRow } from '../runs/store.js';
import { csvRow, UTF8_BOM } from './csv.js';
import { EXPORT_CHUNK, RUNS_CSV_HEADER } from './runs.js';

/*
 * The runs export writes each record itself, from the texts the database sends, instead of
 * building cells for csvRow. Its bytes must be what csvRow writes for the cells of each run as
 * the models read them: this file builds that reference from the models and compares the two,
 * over runs made to carry what needs care (formula starts, quotes, commas and line breaks in
 * names, sites and pages; missing pages and outputs; tables, choices and unknown inputs; several
 * requests for one run, and one from another organisation), across more than one chunk with a
 * tie on one instant at the chunk's edge, both ways the requests are found.
 */
describe('runs export', () => {
  let db: TestDatabase;
  let orgId: number;
  let widgetIds: number[];

  const widget = (
    orgId: number,
    i: number,
    name: string,
    calculatorId: string,
    edit: Partial<WidgetSettings> = {},
  ) =>
    Widget.create({
      organizationId: orgId,
      publicKey: `wk_export${String(orgId).padStart(4, '0')}${String(i).padStart(10, '0')}`,
      name,
      calculatorId,
      status: 'live',
      allowedOrigins: ['https://www.brackenridge-ground.example'],
      settings: { ...defaultWidgetSettings(), ...edit },
      release: '0.1.0',
    });

  beforeAll(async () => {
    db = await createTestDatabase();
    const org = await Organization.create({
      name: 'Brackenridge Ground & Damp',
      slug: 'export-brackenridge',
    });
    const other = await Organization.create({ name: 'Fenwick Clay Testing', slug: 'export-fenwick' });
    orgId = org.id;
    const widgets = [
      await widget(orgId, 1, '=HYPERLINK("http://x.example","y"), rising damp', 'tube-rise', {
        inputs: { gravity: { mode: 'hidden' }, liquid: { mode: 'locked', default: 'water' } },
      }),
      await widget(orgId, 2, 'Slab check\r\nsecond line', 'soil-capillary-rise', {
        units: { system: 'us', visitorMaySwitch: true },
      }),
      await widget(orgId, 3, '-minus first, then a comma', 'absorption-coefficient'),
      await widget(orgId, 4, 'Crack wicking', 'slot-rise'),
    ];
    widgetIds = widgets.map((w) => w.id);
    const otherWidget = await widget(other.id, 1, 'Fenwick tube', 'tube-rise');

    const rows: RunRow[] = [];
    const base = Date.parse('2026-03-01T00:00:00Z');
    for (let i = 0; i < EXPORT_CHUNK + 100; i++) {
      const w = widgets[i % widgets.length]!;
      const inputs: Record<string, number> =
        w.calculatorId === 'tube-rise'
          ? { diameter: 0.0002 + (i % 37) * 0.0001 }
          : w.calculatorId === 'soil-capillary-rise'
            ? { d10: 0.00001 * (1 + (i % 11)), waterTableDepth: 0.5 + (i % 7) * 0.25 }
            : w.calculatorId === 'slot-rise'
              ? { gap: 0.0001 * (1 + (i % 90)) }
              : {};
      // Eighty runs at one instant around the end of the first chunk (newest first), the rest a minute apart.
      const at = i >= 40 && i < 120 ? base + 40 * 60_000 : base + i * 60_000;
      const origin = i % 50 === 7 ? '=evil.example, "quoted"' : 'https://www.brackenridge-ground.example';
      const row = runAt(w, new Date(at).toISOString(), inputs, {
        origin,
        pageUrl: i % 9 === 0 ? null : i % 9 === 1 ? `${origin}/a,b?q="x"\nnext` : undefined,
        unitSystem: i % 4 === 1 ? 'si' : undefined,
        agreed: i % 13 !== 5,
      });
      if (i % 97 === 3) row.clientResult = { ...row.clientResult, outputs: undefined };
      if (i % 97 === 4) row.clientResult = { ...row.clientResult, outputs: null };
      if (i % 89 === 6) row.inputs = { ...row.inputs, retired: 12.5, liquid: 'unknown-liquid' };
      if (i % 83 === 2) row.release = '@0.0.9';
      rows.push(row);
    }
    await store(db.sequelize, rows);
    await store(db.sequelize, [runAt(otherWidget, '2026-03-01T00:10:00.000Z', { diameter: 0.001 })]);

    const lead = (organizationId: number, widgetId: number, runId: string | null, name: string) =>
      Lead.create({
        organizationId,
        widgetId,
        runId,
        name,
        email: `${name.toLowerCase().replace(/ /g, '.')}@mail.example`,
        consentText: 'I agree to be contacted about this request.',
        consentAt: new Date('2026-03-02T00:00:00Z'),
        origin: 'https://www.brackenridge-ground.example',
        sendCopy: false,
        createdAt: new Date('2026-03-02T00:00:00Z'),
      });
    // Two requests for one run (the export shows the first), one each for two more (one of
    // them at the tied instant), an unlinked one, and another organisation's request naming
    // one of these runs, which the export must not show.
    await lead(orgId, rows[10]!.widgetId, rows[10]!.id, 'Hester Quayle');
    await lead(orgId, rows[10]!.widgetId, rows[10]!.id, 'Owain Brightwell');
    await lead(orgId, rows[60]!.widgetId, rows[60]!.id, 'Priya Venn');
    await lead(orgId, rows[900]!.widgetId, rows[900]!.id, 'Caspar Doyle');
    await lead(orgId, rows[11]!.widgetId, null, 'Maud Farrant');
    await lead(other.id, otherWidget.id, rows[20]!.id, 'Idris Lusk');
  });
  afterAll(() => db.drop());

  /** What csvRow writes for each run's cells, from the models: the export's bytes must be these. */
  async function reference(where: WhereOptions, dir: 'ASC' | 'DESC'): Promise<string> {
    const runs = await Run.findAll({
      where: { organizationId: orgId, ...where },
      order: [
        ['createdAt', dir],
        ['id', dir],
      ],
    });
    const widgets = new Map(
      (await Widget.findAll({ where: { organizationId: orgId } })).map((w) => [w.id, w]),
    );
    const first = new Map<string, number>();
    for (const l of await Lead.findAll({ where: { organizationId: orgId } }))
      if (l.runId) first.set(l.runId, Math.min(first.get(l.runId) ?? l.id, l.id));
    let text = UTF8_BOM + csvRow(RUNS_CSV_HEADER);
    for (const r of runs) {
      const w = widgets.get(r.widgetId);
      const system = w?.settings.units.system ?? r.unitSystem;
      const p = runPrinter(r.calculatorId, w?.settings ?? { inputs: {} }, system);
      const outputs = (r.clientResult as { outputs?: Record<string, number | null> | null }).outputs ?? {};
      text += csvRow([
        r.createdAt,
        r.id,
        r.widgetId,
        w?.name ?? `Widget ${r.widgetId}`,
        p.title,
        valuesCell(p.inputs(r.inputs as Record<string, number | string>)),
        valuesCell(p.outputs(outputs)),
        system,
        (r.warningCodes as string[]).join(' '),
        r.origin,
        r.pageUrl,
        r.release,
        r.agreed,
        first.get(r.id) ?? null,
      ]);
    }
    return text;
  }

  async function exported(query: Record<string, unknown>, linkedLeadsLimit?: number): Promise<string> {
    const runs = createRunService({ sequelize: db.sequelize, linkedLeadsLimit });
    let text = '';
    for await (const part of runs.exportCsv(orgId, runExportQuerySchema.parse(query))) text += part;
    return text;
  }

  it.each([
    ['newest first, the requests read whole', '-createdAt', undefined],
    ['newest first, the requests looked up per run', '-createdAt', 0],
    ['oldest first, the requests read whole', 'createdAt', undefined],
    ['oldest first, the requests looked up per run', 'createdAt', 0],
  ] as const)('writes what csvRow writes for every run: %s', async (_label, sort, limit) => {
    const want = await reference({}, sort === 'createdAt' ? 'ASC' : 'DESC');
    const got = await exported({ sort }, limit);
    expect(got).toBe(want);
    // The fixture exercises what it is meant to: every run, over more than one chunk, the
    // guarded and quoted cells, and the requests.
    const records = readCsv(got).slice(1);
    expect(records.length).toBe(EXPORT_CHUNK + 100);
    expect(got).toContain(`,"'=HYPERLINK(""http://x.example"",""y""), rising damp",`);
    expect(got).toContain(`"'=evil.example, ""quoted"""`);
    expect(got).toContain(',"Slab check\r\nsecond line",');
    expect(records.filter((r) => r[13] !== '').map((r) => Number(r[13]))).toHaveLength(3);
  });

  it('writes the same for a filtered window of one widget', async () => {
    const window = { from: '2026-03-01', to: '2026-03-01', widgetId: widgetIds[1] };
    const want = await reference(
      {
        widgetId: widgetIds[1],
        createdAt: { [Op.gte]: new Date('2026-03-01T00:00:00Z'), [Op.lt]: new Date('2026-03-02T00:00:00Z') },
      },
      'DESC',
    );
    expect(readCsv(want).length).toBeGreaterThan(100);
    expect(await exported(window)).toBe(want);
    expect(await exported(window, 0)).toBe(want);
  });
});
