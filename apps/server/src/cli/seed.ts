import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { loadConfig } from '../config.js';
import { createSequelize } from '../db/sequelize.js';
import { seedDemo } from '../db/seed/demo.js';
import { seedDemoBilling } from '../db/seed/demo-billing.js';
import { createPaymentsClient } from '../billing/provider.js';
import { initModels, Membership, Organization, User } from '../db/models/index.js';
import { demoSiteOrigins, seedDemoWidgets } from '../db/seed/demo-widgets.js';
import { createReleaseService } from '../releases/service.js';
import { releaseDirsOf } from '../releases/paths.js';
import { createWidgetService } from '../widgets/service.js';
import { serverVersion } from '../version.js';

const config = loadConfig();
const sequelize = createSequelize(config.db);
initModels(sequelize);
try {
  const summary = await seedDemo(sequelize, { bcryptCost: config.auth.bcryptCost });
  const org = await Organization.findOne({ where: { slug: 'brackenridge-ground' } });
  const owner =
    org &&
    (await Membership.findOne({ where: { organizationId: org.id, role: 'owner' }, order: [['id', 'ASC']] }));
  const lines = [summary];
  if (org && owner) {
    // The plan first: the demo widgets need a plan that allows two live ones.
    const ownerUser = await User.findByPk(owner.userId, { attributes: ['email'] });
    lines.push(
      await seedDemoBilling(
        sequelize,
        createPaymentsClient(config.payments),
        org,
        ownerUser?.email ?? '',
        config.publicUrl,
      ),
    );
    // The releases as the app serves them: the published ones first, then this build's, so a demo
    // widget pinned to a published release gets that release's script and SRI hash.
    const releaseDirs = releaseDirsOf(config);
    const releases = createReleaseService(releaseDirs.build, config.publicUrl, releaseDirs.published);
    const widgets = createWidgetService({
      sequelize,
      releases,
      publicUrl: config.publicUrl,
      widgetVersion: serverVersion,
    });
    const demo = await seedDemoWidgets(widgets, org.id, owner.userId, demoSiteOrigins(config.demo.sitePort));
    lines.push(...demo.lines);
    if (config.demo.snippetsFile) {
      mkdirSync(path.dirname(config.demo.snippetsFile), { recursive: true });
      writeFileSync(
        config.demo.snippetsFile,
        JSON.stringify(
          {
            widgets: demo.widgets.map((w) => ({ name: w.name, snippet: w.embed.snippet })),
          },
          null,
          2,
        ),
      );
    }
  }
  console.log(lines.join('\n'));
} finally {
  await sequelize.close();
}
