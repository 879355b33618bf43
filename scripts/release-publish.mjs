// `npm run release:publish`: build the widget (and the calc-core and contracts it is made from)
// for packages/widget's version, then publish that build as releases/<version>/ with its engine,
// changelog and checksum list (scripts/lib/releases.mjs). Commit the new folder afterwards.
//   --no-build        publish what packages/widget/dist/releases/<version>/ holds now
//   --out <dir>       publish into another releases folder (tests use a temporary one)
import path from 'node:path';
import { parseArgs } from 'node:util';
import { log, run } from './lib/proc.mjs';
import { publishRelease } from './lib/releases.mjs';

const { values } = parseArgs({
  options: { 'no-build': { type: 'boolean', default: false }, out: { type: 'string' } },
});

if (!values['no-build']) run('npx', ['turbo', 'run', 'build', '--filter=@wickstone/widget']);
try {
  const published = await publishRelease(values.out ? { releasesDir: path.resolve(values.out) } : {});
  log(
    `published ${published.version} (engine ${published.info.engineVersion}, ${published.info.changelog.length} changelog entries) to ${path.relative(process.cwd(), published.dir) || published.dir}`,
  );
} catch (err) {
  console.error(`release:publish: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
}
