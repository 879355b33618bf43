// Builds the widget release dist/releases/<version>/: a small loader per calculator (what snippets
// point at), the shared runtime (the first view), an engine per calculator, and what follows first
// paint: the full widget (app), each calculator's texts, the extras and the tables; the Manrope
// variable font, a brotli and a gzip copy of every script, and manifest.json (file names, SRI
// hashes, sizes). Fails when any calculator's first flight (its loader, the runtime and its engine,
// brotli) is over FLIGHT_LIMIT (scripts/bundle.mjs; the goal is 14 KB) or carries texts or Preact,
// printing every figure and, beside each first flight, what computes alone (calc-core's share: the
// floor under any first view of that calculator). Only this version's folder is ever written:
// earlier releases stay byte-for-byte as published (embed snippets pin them by SRI hash).
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
  buildChunks,
  buildLoader,
  calcCoreBrotli,
  sealChain,
  checkContents,
  closure,
  FLIGHT_GOAL,
  FLIGHT_LIMIT,
  MANROPE_FILE,
  kb,
  measure,
  widgetDir,
  widgetVersion,
} from './scripts/bundle.mjs';

const require = createRequire(import.meta.url);
const fontFile = path.join(
  path.dirname(require.resolve('@fontsource-variable/manrope/package.json')),
  'files',
  MANROPE_FILE,
);

// `WICKSTONE_RELEASES_OUT` writes elsewhere (tests build a second release into a temporary folder).
const releasesDir = process.env.WICKSTONE_RELEASES_OUT ?? path.join(widgetDir, 'dist', 'releases');
const finalDir = path.join(releasesDir, widgetVersion);
// Written beside the release and renamed into place, so a server never reads a half-written one.
const stagingDir = path.join(releasesDir, `.staging-${widgetVersion}-${process.pid}`);

const previous = existsSync(path.join(finalDir, 'manifest.json'))
  ? JSON.parse(readFileSync(path.join(finalDir, 'manifest.json'), 'utf8'))
  : null;

rmSync(stagingDir, { recursive: true, force: true });
mkdirSync(stagingDir, { recursive: true });

/** Writes a file with its precompressed copies; returns its figures. */
function emit(name, code) {
  const m = measure(code);
  writeFileSync(path.join(stagingDir, name), m.buffer);
  writeFileSync(path.join(stagingDir, `${name}.br`), m.brotli);
  writeFileSync(path.join(stagingDir, `${name}.gz`), m.gzip);
  return m;
}

const failures = [];
const files = {};
const chunkFigures = {};
console.log(`Wickstone widget ${widgetVersion} (calc-core ${calcCoreVersion})`);
try {
  const {
    files: chunks,
    engines,
    texts,
    extras,
    tables,
    app,
  } = await buildChunks(calculators.map((c) => c.id));
  for (const calc of calculators) {
    if (!engines[calc.id]) throw new Error(`no engine chunk for ${calc.id}`);
    if (!texts[calc.id]) throw new Error(`no texts chunk for ${calc.id}`);
  }
  sealChain(chunks, { engines, texts, extras, tables, app });
  for (const [name, chunk] of chunks) {
    const m = emit(name, chunk.code);
    chunkFigures[name] = {
      integrity: m.integrity,
      bytes: m.bytes,
      gzipBytes: m.gzipBytes,
      brotliBytes: m.brotliBytes,
      imports: chunk.imports,
    };
  }
  console.log(`${'chunk'.padEnd(40)}${'bytes'.padStart(8)}${'gzip'.padStart(8)}${'brotli'.padStart(8)}`);
  for (const [name, f] of Object.entries(chunkFigures))
    console.log(
      `${name.padEnd(40)}${String(f.bytes).padStart(8)}${String(f.gzipBytes).padStart(8)}${String(f.brotliBytes).padStart(8)}`,
    );

  console.log(
    `\nfirst flight per calculator (loader + runtime + engine: the first view, usable), compressed; goal ${kb(FLIGHT_GOAL)}, build fails above ${kb(FLIGHT_LIMIT)}`,
  );
  console.log(
    `${'calculator'.padEnd(24)}${'loader br'.padStart(10)}${'gzip'.padStart(9)}${'brotli'.padStart(9)}${'vs goal'.padStart(9)}${'computes'.padStart(10)}   chunks`,
  );
  for (const calc of calculators) {
    const engine = engines[calc.id];
    const file = `wickstone-${calc.id}.js`;
    const loader = emit(file, await buildLoader(calc.id, calcCoreVersion, chunks, engine));
    const flight = [...closure(chunks, engine)];
    for (const f of flight.filter((x) => chunks.get(x).hasTexts))
      failures.push(
        `${f}, in ${calc.id}'s first flight, carries a calculator's texts: import them only from <id>.texts.ts`,
      );
    for (const f of flight.filter((x) => chunks.get(x).hasPreact))
      failures.push(
        `${f}, in ${calc.id}'s first flight, carries Preact: the first view is plain DOM (src/first/)`,
      );
    const gzip = loader.gzipBytes + flight.reduce((s, f) => s + chunkFigures[f].gzipBytes, 0);
    const brotli = loader.brotliBytes + flight.reduce((s, f) => s + chunkFigures[f].brotliBytes, 0);
    // What computes, alone: the floor under any first view of this calculator.
    const computes = calcCoreBrotli(chunks, flight);
    files[calc.id] = {
      file,
      integrity: loader.integrity,
      bytes: loader.bytes,
      gzipBytes: loader.gzipBytes,
      brotliBytes: loader.brotliBytes,
      engine,
      texts: texts[calc.id],
      firstFlight: {
        files: [file, ...flight],
        gzipBytes: gzip,
        brotliBytes: brotli,
        computesBrotliBytes: computes,
      },
    };
    // Judged on brotli, what browsers get over HTTPS; gzip is printed beside it.
    const over = brotli > FLIGHT_LIMIT;
    const vsGoal = brotli - FLIGHT_GOAL;
    console.log(
      `${calc.id.padEnd(24)}${String(loader.brotliBytes).padStart(10)}${String(gzip).padStart(9)}${String(brotli).padStart(9)}${`${vsGoal > 0 ? '+' : ''}${vsGoal}`.padStart(9)}${String(computes).padStart(10)}   ${flight.join(' ')}${over ? '   OVER THE LIMIT' : ''}`,
    );
    if (over)
      failures.push(
        `${calc.id}: first flight ${kb(brotli)} brotli (${kb(gzip)} gzip), over ${kb(FLIGHT_LIMIT)}`,
      );
    for (const p of checkContents(calc.id, chunks.get(engine).code, calculators))
      failures.push(`${engine} ${p}`);
    for (const p of checkContents(calc.id, readFileSync(path.join(stagingDir, file), 'utf8'), calculators))
      failures.push(`${file} ${p}`);
  }
  console.log(
    "loader br: the loader alone, brotli (in the flight's brotli figure); computes: calc-core's code in the first flight alone (the calculator, its shared inputs, units, validation, headline), one file, brotli; the rest is the loader and the first view",
  );
  copyFileSync(fontFile, path.join(stagingDir, MANROPE_FILE));
  const manifest = {
    version: widgetVersion,
    calcCoreVersion,
    files,
    chunks: chunkFigures,
    fonts: { manrope: MANROPE_FILE },
  };
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

const changed =
  previous && Object.entries(files).some(([id, f]) => previous.files?.[id]?.integrity !== f.integrity);
if (changed) {
  console.warn(
    `note: release ${widgetVersion} was rebuilt with different contents; bump packages/widget's version before publishing it, since snippets pin files by SRI hash`,
  );
}
console.log(`wrote ${path.relative(process.cwd(), finalDir) || finalDir}`);
