// Bundles one calculator subpath the way a widget would (Vite library build, minified, ESM) and
// prints its gzipped size, then a plain calculate() throughput figure. Run after `npm run build`.
import { gzipSync } from 'node:zlib';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { build } from 'vite';

const here = path.dirname(fileURLToPath(import.meta.url));
const dist = path.resolve(here, '../dist');
const subpath = process.argv[2] ?? 'tube-rise';

async function bundleSize(entry) {
  const output = await build({
    configFile: false,
    logLevel: 'silent',
    build: {
      write: false,
      minify: true,
      lib: { entry, formats: ['es'], fileName: 'bundle' },
    },
  });
  const outputs = (Array.isArray(output) ? output : [output]).flatMap((o) => o.output);
  const code = outputs
    .filter((o) => o.type === 'chunk')
    .map((o) => o.code)
    .join('\n');
  return { raw: Buffer.byteLength(code), gzip: gzipSync(code, { level: 9 }).length };
}

const one = await bundleSize(path.join(dist, 'calculators', `${subpath}.js`));
console.log(
  `calc-core subpath ./calculators/${subpath}: ${one.raw} bytes minified, ${one.gzip} bytes gzipped`,
);
const all = await bundleSize(path.join(dist, 'index.js'));
console.log(`calc-core root (every calculator): ${all.raw} bytes minified, ${all.gzip} bytes gzipped`);

const { calculate } = await import(path.join(dist, 'index.js'));
// Batches rather than one long loop: on a shared machine the median and the best batch say more
// than a mean that other processes' load can swamp.
const batch = 2000;
const rates = [];
for (let i = 0; i < 2000; i++) calculate('tube-rise', {});
for (let b = 0; b < 15; b++) {
  const start = process.hrtime.bigint();
  for (let i = 0; i < batch; i++) calculate('tube-rise', { diameter: 1e-3 + (i % 100) * 1e-6 });
  rates.push(batch / (Number(process.hrtime.bigint() - start) / 1e9));
}
rates.sort((x, y) => x - y);
const median = rates[Math.floor(rates.length / 2)];
const best = rates[rates.length - 1];
console.log(
  `calculate('tube-rise') throughput: median ${Math.round(median)} runs/s (${(1e6 / median).toFixed(1)} µs/run), best batch ${Math.round(best)} runs/s`,
);
