// Builds the widget release dist/releases/<version>/: one self-contained script per calculator,
// the Manrope files they use, and manifest.json (file names, SRI hashes, sizes). Fails when any
// file is over the 35 KB gzipped budget. Only this version's folder is ever written: earlier
// releases stay byte-for-byte as published (embed snippets pin them by SRI hash).
import {
  copyFileSync,
  existsSync,
  mkdirSync,
  readFileSync,
  renameSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { calculators, VERSION as calcCoreVersion } from '@wickstone/calc-core';
import {
  bundleCalculator,
  checkContents,
  GOAL_GZIP,
  kb,
  LIMIT_GZIP,
  widgetDir,
  widgetVersion,
} from './scripts/bundle.mjs';

const require = createRequire(import.meta.url);
const fontsDir = path.join(path.dirname(require.resolve('@fontsource/manrope/package.json')), 'files');
const FONTS = {
  'manrope-400': 'manrope-latin-400-normal.woff2',
  'manrope-600': 'manrope-latin-600-normal.woff2',
  'manrope-700': 'manrope-latin-700-normal.woff2',
};

const releasesDir = path.join(widgetDir, 'dist', 'releases');
const finalDir = path.join(releasesDir, widgetVersion);
// Written beside the release and renamed into place, so a server never reads a half-written one.
const stagingDir = path.join(releasesDir, `.staging-${widgetVersion}-${process.pid}`);

const previous = existsSync(path.join(finalDir, 'manifest.json'))
  ? JSON.parse(readFileSync(path.join(finalDir, 'manifest.json'), 'utf8'))
  : null;

rmSync(stagingDir, { recursive: true, force: true });
mkdirSync(stagingDir, { recursive: true });

const files = {};
const failures = [];
console.log(`Wickstone widget ${widgetVersion} (calc-core ${calcCoreVersion})`);
console.log(
  `${'file'.padEnd(38)}${'bytes'.padStart(9)}${'gzip'.padStart(10)}   budget ${kb(LIMIT_GZIP)} · goal ${kb(GOAL_GZIP)}`,
);
try {
  for (const calc of calculators) {
    const file = `wickstone-${calc.id}.js`;
    const built = await bundleCalculator(calc.id);
    writeFileSync(path.join(stagingDir, file), built.code);
    files[calc.id] = { file, integrity: built.integrity, bytes: built.bytes, gzipBytes: built.gzipBytes };
    const over = built.gzipBytes > LIMIT_GZIP;
    const goal =
      built.gzipBytes <= GOAL_GZIP ? 'within goal' : `${kb(built.gzipBytes - GOAL_GZIP)} over goal`;
    console.log(
      `${file.padEnd(38)}${String(built.bytes).padStart(9)}${String(built.gzipBytes).padStart(10)}   ${over ? 'OVER BUDGET' : 'ok'} · ${goal}`,
    );
    if (over) failures.push(`${file} is ${kb(built.gzipBytes)} gzipped, over the ${kb(LIMIT_GZIP)} budget`);
    for (const p of checkContents(calc.id, built.code, calculators)) failures.push(`${file} ${p}`);
  }
  for (const name of Object.values(FONTS))
    copyFileSync(path.join(fontsDir, name), path.join(stagingDir, name));
  const manifest = { version: widgetVersion, calcCoreVersion, files, fonts: FONTS };
  writeFileSync(path.join(stagingDir, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);

  if (failures.length > 0) {
    rmSync(stagingDir, { recursive: true, force: true });
    for (const f of failures) console.error(`FAIL ${f}`);
    process.exit(1);
  }
  rmSync(finalDir, { recursive: true, force: true });
  renameSync(stagingDir, finalDir);
} catch (err) {
  rmSync(stagingDir, { recursive: true, force: true });
  throw err;
}

const largest = Math.max(...Object.values(files).map((f) => f.gzipBytes));
console.log(
  `largest file ${kb(largest)} gzipped: ${largest <= GOAL_GZIP ? 'within' : 'above'} the ${kb(GOAL_GZIP)} goal, within the ${kb(LIMIT_GZIP)} budget`,
);
const changed =
  previous && Object.entries(files).some(([id, f]) => previous.files?.[id]?.integrity !== f.integrity);
if (changed) {
  console.warn(
    `note: release ${widgetVersion} was rebuilt with different contents; bump packages/widget's version before publishing it, since snippets pin files by SRI hash`,
  );
}
console.log(`wrote ${path.relative(process.cwd(), finalDir) || finalDir}`);
