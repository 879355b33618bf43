// Compares the first views two release folders render (scripts/first-views.mjs): every calculator,
// both unit systems, the defaults and seeded random inputs, markup compared byte for byte.
// Usage: node dev/compare-first-views.mjs <release dir A> <release dir B> [samples per system]
// e.g. copy dist/releases/<version> aside, change something, build, and compare the two.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { compareViews, firstViews } from '../scripts/first-views.mjs';

const [dirA, dirB, samplesArg = '12'] = process.argv.slice(2);
if (dirA === undefined || dirB === undefined)
  throw new Error('usage: node dev/compare-first-views.mjs <release dir A> <release dir B> [samples]');
const release = (dir) => {
  const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8'));
  return {
    // The first flight without its loader: the runtime, then the engine.
    files: (id) => manifest.files[id].firstFlight.files.slice(1),
    read: (file) => readFileSync(path.join(dir, file), 'utf8'),
  };
};
const options = { samples: Number(samplesArg) };
const a = firstViews(release(dirA), options);
const b = firstViews(release(dirB), options);
const { compared, differ } = compareViews(a, b);
for (const d of differ.slice(0, 5)) {
  const at = [...d.a].findIndex((c, i) => c !== d.b[i]);
  console.log(
    `${d.label} differs at ${at}:\n  A …${d.a.slice(Math.max(0, at - 120), at + 120)}…\n  B …${d.b.slice(Math.max(0, at - 120), at + 120)}…`,
  );
}
for (const [name, run] of [
  ['A', a],
  ['B', b],
])
  if (run.errors.length > 0)
    console.log(`${name} reported ${run.errors.length} errors, first: ${run.errors[0]}`);
console.log(`${compared} first-view states compared (every calculator, si and us): ${differ.length} differ`);
process.exitCode = differ.length === 0 && a.errors.length === 0 && b.errors.length === 0 ? 0 : 1;
