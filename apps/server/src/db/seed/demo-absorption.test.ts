import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { createTestApp, type TestApp } from '../../../testing/client.js';
import { seedOrgWithTeam } from '../../../testing/fixtures.js';
import { createReleaseService } from '../../releases/service.js';
import { defaultReleasesDir } from '../../releases/paths.js';
import { serverVersion } from '../../version.js';
import { createWidgetService } from '../../widgets/service.js';
import { demoSiteOrigins, seedDemoWidgets } from './demo-widgets.js';

// The demo's live widgets, the absorption-coefficient one among them, with invented runs that the
// server's own calc-core reproduces (every stored run agreed).

describe('the demo absorption widget', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('include a live absorption-coefficient widget on the demo site, with invented readings that recompute', async () => {
    const org = await seedOrgWithTeam('Demo widgets check');
    const widgets = createWidgetService({
      sequelize: t.db.sequelize,
      releases: createReleaseService(defaultReleasesDir, t.db.config.publicUrl),
      publicUrl: t.db.config.publicUrl,
      widgetVersion: serverVersion,
    });
    const { widgets: made } = await seedDemoWidgets(
      widgets,
      org.id,
      org.users.owner.id,
      demoSiteOrigins(5181),
    );
    const absorption = made.find((w) => w.calculatorId === 'absorption-coefficient');
    expect(absorption?.status).toBe('live');
    expect(absorption?.allowedOrigins).toEqual(demoSiteOrigins(5181));
    expect(absorption?.embed.snippet).toContain('wickstone-absorption-coefficient.js');
    const rows = await t.db.sequelize.query<{ n: number; agreed: number; rates: number }>(
      `SELECT COUNT(*) AS n, SUM(agreed) AS agreed,
              SUM(JSON_TYPE(JSON_EXTRACT(server_result, '$.outputs.absorptionCoefficient')) = 'DOUBLE') AS rates
         FROM runs WHERE widget_id = ?`,
      { replacements: [absorption?.id], type: QueryTypes.SELECT },
    );
    expect(Number(rows[0]?.n)).toBe(180);
    expect(Number(rows[0]?.agreed)).toBe(180);
    // The invented readings lie close to a line: every run gives a rate, none withheld.
    expect(Number(rows[0]?.rates)).toBe(180);
  });
});
