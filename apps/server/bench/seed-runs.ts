// Seed 1,000,000 invented runs for one invented organisation over the last year, across a few
// widgets and sites, through the same code the embed API stores runs with (storeRuns: bulk
// multi-row INSERTs of the runs and the rollup upserts, in one transaction per batch), then check
// the rollups against a GROUP BY over the raw runs.
// Run: npx tsx apps/server/bench/seed-runs.ts [--runs 1000000] [--db wst_bench_usage] [--fresh]
import { calculate, type CalculationResult } from '@wickstone/calc-core';
import { defaultWidgetSettings, type WidgetSettings } from '@wickstone/contracts';
import { randomUUID } from 'node:crypto';
import { Organization, Run, Widget } from '../src/db/models/index.js';
import { runRowFrom, seededRandom } from '../src/runs/invent.js';
import { storeLeadsForRuns, storeRuns, type LinkedLeadRow, type RunRow } from '../src/runs/store.js';
import { rollupsFromRaw, storedRollups } from '../src/usage/rollups.js';
import { args, BENCH_ORG_SLUG, benchOrganization, openBenchDatabase, seconds } from './common.js';

const TOTAL = Number(args.runs);
const BATCH = Number(args.batch);
const DAYS = 365;
const DAY = 86_400_000;

// The same invented year every time.
const rnd = seededRandom(6);
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)] as T;
const between = (lo: number, hi: number) => lo + rnd() * (hi - lo);

const SITES = [
  ['https://www.brackenridge-ground.example', 0.55],
  ['https://portal.brackenridge-ground.example', 0.25],
  ['https://www.ashby-homes.example', 0.12],
  ['https://surveys.market-lowe-builders.example', 0.08],
] as const;
const site = () => {
  let x = rnd();
  for (const [origin, share] of SITES) if ((x -= share) < 0) return origin;
  return SITES[0][0];
};

interface WidgetPlan {
  name: string;
  calculatorId: string;
  share: number;
  system: 'si' | 'us';
  inputs: () => Record<string, number | string>;
}
const PLAN: WidgetPlan[] = [
  {
    name: 'Rising damp: capillary rise in a pore',
    calculatorId: 'tube-rise',
    share: 0.4,
    system: 'si',
    inputs: () => ({ diameter: between(0.0001, 0.006), temperatureC: Math.round(between(2, 30)) }),
  },
  {
    name: 'Slab check: soil capillary rise',
    calculatorId: 'soil-capillary-rise',
    share: 0.3,
    system: 'us',
    inputs: () => ({ d10: between(0.00001, 0.0008), waterTableDepth: between(0.3, 4) }),
  },
  {
    name: 'Crack wicking: rise between walls',
    calculatorId: 'slot-rise',
    share: 0.2,
    system: 'si',
    inputs: () => ({ gap: between(0.0001, 0.008) }),
  },
  {
    name: 'Render soak time',
    calculatorId: 'wicking-time',
    share: 0.1,
    system: 'si',
    inputs: () => ({ length: between(0.005, 0.3), poreRadius: between(1e-6, 5e-5) }),
  },
];
const FIRST = ['Hester', 'Owain', 'Priya', 'Caspar', 'Maud', 'Idris', 'Nell', 'Tobias', 'Wren', 'Anselm'];
const LAST = [
  'Quayle',
  'Brightwell',
  'Venn',
  'Doyle',
  'Farrant',
  'Lusk',
  'Orme',
  'Pennick',
  'Straker',
  'Tull',
];

async function makeOrganization(): Promise<{
  org: Organization;
  widgets: (Widget & { plan: WidgetPlan })[];
}> {
  const org = await Organization.create({
    name: 'Brackenridge Ground & Damp (benchmark)',
    slug: BENCH_ORG_SLUG,
  });
  const widgets = [];
  for (const [i, plan] of PLAN.entries()) {
    const settings: WidgetSettings = {
      ...defaultWidgetSettings(),
      units: { system: plan.system, visitorMaySwitch: true },
    };
    const w = await Widget.create({
      organizationId: org.id,
      publicKey: `wk_bench${String(i).padStart(15, '0')}`,
      name: plan.name,
      calculatorId: plan.calculatorId,
      status: 'live',
      allowedOrigins: SITES.map(([o]) => o),
      settings,
      release: '0.1.0',
    });
    widgets.push(Object.assign(w, { plan }));
  }
  return { org, widgets };
}

const { sequelize } = await openBenchDatabase({ fresh: args.fresh });
try {
  let org = await benchOrganization();
  const have = org ? await Run.count({ where: { organizationId: org.id } }) : 0;
  if (org && have >= TOTAL) {
    console.log(
      `${args.db}: ${have.toLocaleString('en')} runs already seeded for ${org.name}; use --fresh to seed again`,
    );
  } else {
    if (org) {
      console.log(`${args.db}: only ${have.toLocaleString('en')} runs; starting again`);
      await org.destroy();
    }
    const made = await makeOrganization();
    org = made.org;
    // A pool of real calculations per widget: each run takes one, as visitors repeat common inputs.
    const pools = new Map<number, CalculationResult[]>(
      made.widgets.map((w) => [
        w.id,
        Array.from({ length: 400 }, () => calculate(w.calculatorId, w.plan.inputs())),
      ]),
    );
    const chooseWidget = () => {
      let x = rnd();
      for (const w of made.widgets) if ((x -= w.plan.share) < 0) return w;
      return made.widgets[0]!;
    };

    // Runs per day: weekdays busier than weekends, and the firm growing over the year.
    const end =
      Date.UTC(new Date().getUTCFullYear(), new Date().getUTCMonth(), new Date().getUTCDate()) + DAY;
    const start = end - DAYS * DAY;
    const weights = Array.from({ length: DAYS }, (_, d) => {
      const weekday = new Date(start + d * DAY).getUTCDay();
      return (weekday === 0 || weekday === 6 ? 0.45 : 1) * (0.7 + (0.6 * d) / DAYS);
    });
    const sum = weights.reduce((a, b) => a + b, 0);
    const perDay = weights.map((w) => Math.floor((w / sum) * TOTAL));
    perDay[DAYS - 1]! += TOTAL - perDay.reduce((a, b) => a + b, 0);

    const t0 = performance.now();
    let done = 0;
    let leads = 0;
    let batch: RunRow[] = [];
    let batchLeads: { lead: LinkedLeadRow; run: RunRow }[] = [];
    const flush = async () => {
      const rows = batch;
      const linked = batchLeads;
      batch = [];
      batchLeads = [];
      await sequelize.transaction(async (transaction) => {
        await storeRuns(sequelize, rows, transaction);
        await storeLeadsForRuns(sequelize, linked, transaction);
      });
      done += rows.length;
      leads += linked.length;
      if (done % 100_000 < rows.length || done === TOTAL) {
        const s = (performance.now() - t0) / 1000;
        console.log(
          `  ${done.toLocaleString('en')} runs, ${leads.toLocaleString('en')} leads, ${s.toFixed(0)} s (${Math.round(done / s).toLocaleString('en')} runs/s)`,
        );
      }
    };
    for (let d = 0; d < DAYS; d++) {
      const times = Array.from({ length: perDay[d]! }, () => start + d * DAY + Math.floor(rnd() * DAY)).sort(
        (a, b) => a - b,
      );
      for (const at of times) {
        const w = chooseWidget();
        const origin = site();
        const row = runRowFrom(w, pick(pools.get(w.id)!), {
          id: randomUUID(),
          origin,
          createdAt: new Date(at),
          unitSystem: rnd() < 0.2 ? (w.plan.system === 'si' ? 'us' : 'si') : w.plan.system,
          pageUrl: `${origin}/services/${w.calculatorId}`,
          agreed: rnd() > 0.002,
        });
        batch.push(row);
        if (rnd() < 0.004) {
          const first = pick(FIRST);
          const last = pick(LAST);
          const when = new Date(at + 60_000);
          batchLeads.push({
            run: row,
            lead: {
              organizationId: org.id,
              widgetId: w.id,
              runId: row.id,
              status: pick(['new', 'new', 'contacted', 'qualified', 'closed'] as const),
              name: `${first} ${last}`,
              email: `${first}.${last}@mail.example`.toLowerCase(),
              message: 'Please arrange a site assessment.',
              consentText: w.settings.leadForm.consentText,
              consentAt: when,
              origin,
              sendCopy: false,
              createdAt: when,
            },
          });
        }
        if (batch.length >= BATCH) await flush();
      }
    }
    if (batch.length) await flush();
    const seeding = performance.now() - t0;
    console.log(
      `seeded ${done.toLocaleString('en')} runs and ${leads.toLocaleString('en')} leads in ${seconds(seeding)} (${Math.round(done / (seeding / 1000)).toLocaleString('en')} runs/s, batches of ${BATCH}, rollups in the same transactions)`,
    );
  }

  const t1 = performance.now();
  const [stored, raw] = await Promise.all([storedRollups(sequelize), rollupsFromRaw(sequelize)]);
  const same = JSON.stringify(stored) === JSON.stringify(raw);
  console.log(
    `rollups ${same ? 'equal' : 'DIFFER FROM'} a GROUP BY over the raw runs: ${stored.daily.length.toLocaleString('en')} daily rows, ${stored.warnings.length.toLocaleString('en')} warning rows (checked in ${seconds(performance.now() - t1)})`,
  );
  if (!same) process.exitCode = 1;
} finally {
  await sequelize.close();
}
