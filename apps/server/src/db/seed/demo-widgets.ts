import { defaultWidgetSettings, type Widget as WidgetDto, type WidgetSettings } from '@wickstone/contracts';
import { Run, Widget } from '../models/index.js';
import { inventRun, seededRandom, seededUuid } from '../../runs/invent.js';
import { storeLeadsForRuns, storeRuns, type RunRow } from '../../runs/store.js';
import type { WidgetService } from '../../widgets/service.js';

/** The demo site's origins: the firm's website as `npm start` serves it. */
export const demoSiteOrigins = (port: number) => [`http://localhost:${port}`, `http://127.0.0.1:${port}`];

interface DemoWidget {
  name: string;
  calculatorId: string;
  settings: (s: WidgetSettings) => WidgetSettings;
}

const demoWidgets: DemoWidget[] = [
  {
    name: 'Rising damp: capillary rise in a pore',
    calculatorId: 'tube-rise',
    settings: (s) => ({
      ...s,
      inputs: { gravity: { mode: 'hidden' }, liquid: { mode: 'locked', default: 'water' } },
      units: { system: 'si', visitorMaySwitch: true },
      look: {
        ...s.look,
        colors: { background: '#fffdf8', text: '#2b2118', primary: '#5a3d1e', primaryText: '#ffffff' },
        corner: 'soft',
      },
      cautions:
        'Brick and mortar pores are neither round nor clean: measured damp heights on site are usually far below the tube figure. Book a survey before any remedial injection.',
      leadForm: { ...s.leadForm, notify: ['surveys@brackenridge-ground.example'] },
    }),
  },
  {
    name: 'Slab check: soil capillary rise',
    calculatorId: 'soil-capillary-rise',
    settings: (s) => ({
      ...s,
      units: { system: 'us', visitorMaySwitch: true },
      look: {
        ...s.look,
        colors: { background: '#f4f8f7', text: '#14232b', primary: '#1d4e5f', primaryText: '#ffffff' },
        corner: 'round',
      },
      cautions:
        'Frost-susceptible silts under unheated slabs need a geotechnical assessment regardless of this estimate.',
      leadForm: { ...s.leadForm, notify: ['surveys@brackenridge-ground.example'] },
    }),
  },
  {
    name: 'Rising damp: height in a solid wall',
    calculatorId: 'rising-damp-height',
    settings: (s) => ({
      ...s,
      units: { system: 'si', visitorMaySwitch: true },
      look: {
        ...s.look,
        colors: { background: '#fbf8f4', text: '#2b2118', primary: '#7a4a24', primaryText: '#ffffff' },
        corner: 'soft',
      },
      cautions:
        'The sorptivity and evaporation rate of an old wall vary from course to course: we measure both on drilled cores before advising on any treatment.',
      leadForm: { ...s.leadForm, notify: ['surveys@brackenridge-ground.example'] },
    }),
  },
  {
    name: 'Laboratory: water absorption coefficient',
    calculatorId: 'absorption-coefficient',
    settings: (s) => ({
      ...s,
      inputs: { faceArea: { mode: 'locked', default: 0.01 } },
      cautions:
        'Our laboratory cuts 100 mm × 100 mm specimens; send us three for a reported value. One specimen is a first look only.',
      leadForm: { ...s.leadForm, notify: ['laboratory@brackenridge-ground.example'] },
    }),
  },
];

/** An invented partial-immersion test (s, kg) on a 100 mm × 100 mm face: A_w from 0.01 to 0.2 kg/(m²·√s). */
function inventedReadings(rnd: () => number): { time: number; mass: number }[] {
  const aw = 0.01 + rnd() * 0.19;
  const dry = 1.2 + rnd() * 0.8;
  return [0, 300, 1200, 3600, 7200, 14400, 28800, 86400].map((time) => ({
    time,
    mass:
      time === 0
        ? dry
        : Math.round((dry + 0.01 * (0.05 + aw * Math.sqrt(time)) + (rnd() - 0.5) * 4e-5) * 1e5) / 1e5,
  }));
}

const visitors = [
  ['Hester Quayle', 'hester.quayle@mail.example', '4 Mill Lane, Ashby Parva'],
  ['Owain Brightwell', 'owain.b@post.example', 'The Old Forge, Cold Ashby'],
  ['Priya Venn', 'priya.venn@homes.example', '17 Salter Row, Market Lowe'],
  ['Caspar Doyle', 'c.doyle@builders.example', 'Plot 6, Tanner Fields'],
];

/**
 * Invented runs over the last 60 days so the usage and lead screens have something to show,
 * stored the way the embed API stores them (rollups counted in the same transaction).
 */
async function seedRuns(w: Widget, origin: string, seed: number): Promise<number> {
  if (await Run.count({ where: { widgetId: w.id } })) return 0;
  const sequelize = Run.sequelize;
  if (!sequelize) throw new Error('models are not initialised');
  const rnd = seededRandom(seed);
  const now = Date.now();
  const rows: RunRow[] = [];
  for (let i = 0; i < 180; i++) {
    const inputs: Record<string, unknown> =
      w.calculatorId === 'absorption-coefficient'
        ? { readings: inventedReadings(rnd), faceArea: 0.01 }
        : w.calculatorId === 'tube-rise'
          ? {
              diameter: [0.0002, 0.0005, 0.001, 0.002, 0.004][Math.floor(rnd() * 5)] as number,
              temperatureC: 5 + Math.round(rnd() * 20),
            }
          : w.calculatorId === 'rising-damp-height'
            ? {
                wallThickness: [0.225, 0.35, 0.45, 0.6][Math.floor(rnd() * 4)] as number,
                evaporationRate: ((0.3 + Math.round(rnd() * 15) / 10) * 1e-3) / 86_400,
              }
            : {
                d10: [0.00002, 0.00008, 0.0002, 0.0006][Math.floor(rnd() * 4)] as number,
                waterTableDepth: 0.5 + Math.round(rnd() * 30) / 10,
              };
    rows.push(
      inventRun(w, inputs, {
        id: seededUuid(`demo-run-${seed}-${i}`),
        origin,
        unitSystem: rnd() < 0.3 ? 'us' : w.settings.units.system,
        createdAt: new Date(now - Math.floor(rnd() * 60 * 86_400_000)),
      }),
    );
  }
  const statuses = ['new', 'contacted', 'qualified', 'closed'] as const;
  const leads = [0, 1, 2, 3].flatMap((i) => {
    const run = rows[i * 17];
    const v = visitors[(i + seed) % visitors.length] as string[];
    if (!run) return [];
    const lead = {
      organizationId: w.organizationId,
      widgetId: w.id,
      runId: run.id,
      status: statuses[i] ?? 'new',
      name: v[0] ?? null,
      email: v[1] ?? null,
      company: null,
      phone: null,
      message: 'Could you look at the damp along the north wall?',
      siteAddress: v[2] ?? null,
      consentText: w.settings.leadForm.consentText,
      consentAt: run.createdAt,
      origin,
      sendCopy: false,
      createdAt: run.createdAt,
    };
    return [{ lead, run }];
  });
  await sequelize.transaction(async (transaction) => {
    await storeRuns(sequelize, rows, transaction);
    await storeLeadsForRuns(sequelize, leads, transaction);
  });
  return rows.length;
}

/**
 * The demo's live widgets, allowed on the demo site's origins, with invented usage.
 * Idempotent: a widget that exists (by name) is left as it is.
 */
export async function seedDemoWidgets(
  widgets: WidgetService,
  orgId: number,
  ownerId: number,
  origins: string[],
): Promise<{ widgets: WidgetDto[]; lines: string[] }> {
  const out: WidgetDto[] = [];
  const lines: string[] = [];
  for (const [i, d] of demoWidgets.entries()) {
    let w = await Widget.findOne({ where: { organizationId: orgId, name: d.name } });
    if (!w) {
      const created = await widgets.create(orgId, ownerId, {
        name: d.name,
        calculatorId: d.calculatorId,
        allowedOrigins: origins,
      });
      await widgets.update(orgId, created.id, ownerId, {
        status: 'live',
        settings: d.settings(defaultWidgetSettings()),
      });
      w = await Widget.findByPk(created.id);
    }
    if (!w) continue;
    const runs = await seedRuns(w, origins[0] as string, 101 + i);
    const dto = await widgets.get(orgId, w.id);
    out.push(dto);
    lines.push(
      `  widget "${dto.name}" (${dto.status}, key ${dto.publicKey})${runs ? `, ${runs} invented runs` : ''}`,
    );
  }
  return { widgets: out, lines };
}
