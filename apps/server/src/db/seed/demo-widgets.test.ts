import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../../../testing/client.js';
import { snapshotTables } from '../../../testing/fixtures.js';
import { Membership, Organization } from '../models/index.js';
import { createReleaseService } from '../../releases/service.js';
import { defaultReleasesDir } from '../../releases/paths.js';
import { createWidgetService } from '../../widgets/service.js';
import { serverVersion } from '../../version.js';
import { seedDemo } from './demo.js';
import { seedDemoBilling } from './demo-billing.js';
import { demoSiteOrigins, seedDemoWidgets } from './demo-widgets.js';

describe("the demo firm's live widgets", () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('puts tube-rise, soil, rising-damp and absorption widgets live on the demo site, with invented runs of the rising-damp one', async () => {
    await seedDemo(t.db.sequelize, { bcryptCost: 4 });
    const org = await Organization.findOne({ where: { slug: 'brackenridge-ground' } });
    const owner = await Membership.findOne({ where: { organizationId: org!.id, role: 'owner' } });
    await seedDemoBilling(t.db.sequelize, null, org!, '', 'http://127.0.0.1:5230');
    const widgets = createWidgetService({
      sequelize: t.db.sequelize,
      releases: createReleaseService(defaultReleasesDir, 'http://127.0.0.1:5230'),
      publicUrl: 'http://127.0.0.1:5230',
      widgetVersion: serverVersion,
    });
    const origins = demoSiteOrigins(5231);
    const seeded = await seedDemoWidgets(widgets, org!.id, owner!.userId, origins);
    expect(seeded.widgets.map((w) => [w.calculatorId, w.status])).toEqual([
      ['tube-rise', 'live'],
      ['soil-capillary-rise', 'live'],
      ['rising-damp-height', 'live'],
      ['absorption-coefficient', 'live'],
    ]);
    const damp = seeded.widgets[2]!;
    expect(damp.allowedOrigins).toEqual(origins);
    expect(damp.embed.snippet).toContain(`data-wickstone-key="${damp.publicKey}"`);
    // Invented runs over the walls the seed draws from: 225–600 mm thick, 0.3–1.8 mm/day from each face.
    const runs = await t.db.sequelize.query<{ inputs: unknown; clientResult: unknown }>(
      'SELECT inputs, client_result AS clientResult FROM runs WHERE widget_id = ?',
      { replacements: [damp.id], type: QueryTypes.SELECT },
    );
    expect(runs).toHaveLength(180);
    const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as Record<string, unknown>;
    const heights = runs.map((r) =>
      Number((json(r.clientResult).outputs as Record<string, number>).steadyHeight),
    );
    // h_ss = S·√(b/(4eθw)) at S = 1 mm/min½, θw = 0.2: from 0.225 m at 1.8 mm/day to 0.6 m at 0.3 mm/day,
    // 0.474 to 1.897 m (python3: 1e-3/sqrt(60)*sqrt(b/(4*e/86400*0.2))).
    expect(Math.min(...heights)).toBeGreaterThanOrEqual(0.474);
    expect(Math.max(...heights)).toBeLessThanOrEqual(1.898);
    expect(new Set(runs.map((r) => JSON.stringify(json(r.inputs)))).size).toBeGreaterThan(20);

    // Idempotent: a second seed changes nothing.
    const before = await snapshotTables(t.db.sequelize, ['audit_events']);
    await seedDemoWidgets(widgets, org!.id, owner!.userId, origins);
    expect(await snapshotTables(t.db.sequelize, ['audit_events'])).toEqual(before);
  });
});
