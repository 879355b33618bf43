// Prints what each calculator's first flight is made of, from the built release's manifest: the
// loader, the shared runtime, the calc-core chunks and the engine, gzip and brotli, against the
// 14 KB goal; and what a second widget on the page adds (its loader and engine: the runtime is
// already there). The baseline is one self-contained file per calculator, the layout releases had
// before the split, built in this same run from the same sources.
// Usage: npm run bench -w packages/widget (after npm run build). Browser figures: npm run bench -w tests.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { FLIGHT_GOAL, kb, measure, widgetDir, widgetVersion } from './scripts/bundle.mjs';

const file = path.join(widgetDir, 'dist', 'releases', widgetVersion, 'manifest.json');
if (!existsSync(file)) {
  console.error(`no release ${widgetVersion} built yet: run npm run build -w packages/widget first`);
  process.exit(1);
}
const manifest = JSON.parse(readFileSync(file, 'utf8'));

/** The old layout: everything for one calculator in one file (loader, runtime, engine, extras). */
async function monolith(calculatorId) {
  const entry = `
    import { calculator, run } from '@wickstone/calc-core/calculators/${calculatorId}';
    import { mountWidget } from ${JSON.stringify(path.join(widgetDir, 'src/mount.tsx'))};
    import * as extras from ${JSON.stringify(path.join(widgetDir, 'src/extras.ts'))};
    window.Wickstone = { calculator, run, mountWidget, extras };`;
  const result = await build({
    configFile: false,
    root: widgetDir,
    logLevel: 'warn',
    mode: 'production',
    define: { __WICKSTONE_VERSION__: '"bench"', __WICKSTONE_MANROPE_FILE__: '"x.woff2"' },
    oxc: { jsx: { runtime: 'automatic', importSource: 'preact' } },
    plugins: [
      {
        name: 'entry',
        resolveId: (id) => (id.endsWith('bench:entry') ? '\0bench' : null),
        load: (id) => (id === '\0bench' ? entry : null),
      },
    ],
    build: {
      write: false,
      minify: true,
      target: 'es2022',
      lib: { entry: 'bench:entry', formats: ['iife'], name: 'x', fileName: () => 'x.js' },
    },
  });
  const out = (Array.isArray(result) ? result : [result]).flatMap((r) => r.output);
  return measure(out[0].code);
}

console.log(
  `Wickstone widget ${manifest.version} (calc-core ${manifest.calcCoreVersion}): first flight, compressed bytes; goal ${kb(FLIGHT_GOAL)}`,
);
console.log(
  `${'calculator'.padEnd(22)}${'loader'.padStart(8)}${'runtime'.padStart(9)}${'engine+'.padStart(9)}${'gzip'.padStart(8)}${'brotli'.padStart(8)}${'one file'.padStart(10)}${'ratio'.padStart(7)}${'2nd widget'.padStart(12)}${'vs goal'.padStart(9)}`,
);
const runtime = Object.keys(manifest.chunks).find((f) => f.startsWith('runtime-'));
for (const [id, f] of Object.entries(manifest.files)) {
  const rest = f.firstFlight.files.filter((x) => x !== f.file && x !== runtime);
  const restBr = rest.reduce((s, x) => s + manifest.chunks[x].brotliBytes, 0);
  const base = await monolith(id);
  // A second widget of another calculator needs its loader and its engine chunks; the runtime is shared.
  const second = f.brotliBytes + manifest.chunks[f.engine].brotliBytes;
  const vsGoal = f.firstFlight.brotliBytes - FLIGHT_GOAL;
  console.log(
    `${id.padEnd(22)}${String(f.brotliBytes).padStart(8)}${String(manifest.chunks[runtime].brotliBytes).padStart(9)}${String(restBr).padStart(9)}${String(f.firstFlight.gzipBytes).padStart(8)}${String(f.firstFlight.brotliBytes).padStart(8)}${String(base.brotliBytes).padStart(10)}${(f.firstFlight.brotliBytes / base.brotliBytes).toFixed(2).padStart(7)}${String(second).padStart(12)}${`${vsGoal > 0 ? '+' : ''}${vsGoal}`.padStart(9)}`,
  );
}
console.log(
  'loader, runtime, engine+ (the engine and the calc-core chunks it imports) in brotli; gzip and brotli = the whole first flight; one file = the same sources as one self-contained file with the extras (brotli), the layout before the split; ratio = first flight / one file.',
);
