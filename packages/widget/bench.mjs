// Prints the size of each calculator's bundle in the built release against the budget and the
// goal, what each is made of (calc-core's share, measured by bundling that calculator alone), and
// what the same code costs on preact/compat instead of Preact's own hooks and JSX.
// Usage: npm run bench -w packages/widget (after npm run build)
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { bundleCalculator, GOAL_GZIP, kb, LIMIT_GZIP, widgetDir, widgetVersion } from './scripts/bundle.mjs';

const file = path.join(widgetDir, 'dist', 'releases', widgetVersion, 'manifest.json');
if (!existsSync(file)) {
  console.error(`no release ${widgetVersion} built yet: run npm run build -w packages/widget first`);
  process.exit(1);
}
const manifest = JSON.parse(readFileSync(file, 'utf8'));
const probe =
  'import { calculator, run } from "virtual:wickstone-calculator"; globalThis.__probe = [calculator, run];';

console.log(
  `Wickstone widget ${manifest.version} (calc-core ${manifest.calcCoreVersion}): gzipped bytes, budget ${kb(LIMIT_GZIP)}, goal ${kb(GOAL_GZIP)}`,
);
console.log(
  `${'calculator'.padEnd(22)}${'release'.padStart(10)}${'calc-core'.padStart(11)}${'the rest'.padStart(10)}${'on compat'.padStart(11)}${'vs goal'.padStart(11)}`,
);
for (const [id, f] of Object.entries(manifest.files)) {
  const core = await bundleCalculator(id, { probe });
  const compat = await bundleCalculator(id, { runtime: 'compat' });
  const vsGoal = f.gzipBytes - GOAL_GZIP;
  console.log(
    `${id.padEnd(22)}${String(f.gzipBytes).padStart(10)}${String(core.gzipBytes).padStart(11)}${String(f.gzipBytes - core.gzipBytes).padStart(10)}${`+${compat.gzipBytes - f.gzipBytes}`.padStart(11)}${`${vsGoal > 0 ? '+' : ''}${vsGoal}`.padStart(11)}`,
  );
}
console.log(
  'calc-core = that calculator and its share of calc-core bundled alone; the rest = loader, UI, styles and Preact (gzip of parts does not add up exactly).',
);
